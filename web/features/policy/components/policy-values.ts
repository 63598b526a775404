import type { CylinderType, Policy, PolicySettings, UpdatePolicyInput } from '@shared/schemas/policy';

/**
 * The form's own shape: the same paths as the shared schema (so server 400 details land on the right field), but the
 * flowmeter steps are the text the admin types and the growth-drift threshold is in percentage points.
 */
export type PolicyFormValues = {
  baseVersion: number;
  settings: Omit<PolicySettings, 'flowmeterStepsLpm' | 'driftThresholdFio2' | 'supply'> & {
    flowmeterStepsLpm: string;
    driftThresholdFio2: number | undefined;
    supply: Omit<PolicySettings['supply'], 'cylinders'> & { cylinders: CylinderValues[] };
  };
};

type CylinderNumber = 'contentLitres' | 'fullPressure' | 'residualPressure';
/**
 * A newly added cylinder's number boxes start empty (null, not undefined: react-hook-form fills an undefined box from
 * the form's first values, which would copy the numbers of whichever cylinder first had that place in the list).
 */
export type CylinderValues = Omit<CylinderType, CylinderNumber> & { [K in CylinderNumber]: number | null | undefined };

// Percentage points and fractions differ by exactly 100; rounding hides float noise such as 1.4000000000000001.
const tidy = (n: number, digits: number) => Number(n.toFixed(digits));
export const fractionToPoints = (fraction: number) => tidy(fraction * 100, 4);
export const pointsToFraction = (points: number) => tidy(points / 100, 6);

export const formatSteps = (steps: readonly number[]) => steps.join(', ');

export type StepsParse = { ok: true; steps: number[] } | { ok: false; message: string };

const NUMBER = /^\d*\.?\d+$/;

/** "0.025, 0.05, 0.1" → [0.025, 0.05, 0.1]; the order rule itself is the shared schema's. */
export function parseSteps(text: string): StepsParse {
  const parts = text.split(/[,;\s]+/).filter(Boolean);
  if (parts.length === 0) return { ok: false, message: 'Give at least one flowmeter step' };
  const bad = parts.find((part) => !NUMBER.test(part));
  if (bad !== undefined) {
    return { ok: false, message: `“${bad}” is not a number. Separate the steps with commas and use a dot for decimals, e.g. 0.025, 0.05, 0.1` };
  }
  return { ok: true, steps: parts.map(Number) };
}

export function toFormValues(policy: Policy): PolicyFormValues {
  const { settings } = policy;
  return {
    baseVersion: policy.version,
    settings: { ...settings, flowmeterStepsLpm: formatSteps(settings.flowmeterStepsLpm), driftThresholdFio2: fractionToPoints(settings.driftThresholdFio2) },
  };
}

/** What the shared schema checks: the steps as numbers (or nothing, when the text could not be read) and the fraction. */
export function toCandidate(values: PolicyFormValues, steps: StepsParse): UpdatePolicyInput {
  const drift = values.settings.driftThresholdFio2;
  return {
    baseVersion: values.baseVersion,
    settings: {
      ...values.settings,
      flowmeterStepsLpm: steps.ok ? steps.steps : [],
      driftThresholdFio2: (drift === undefined ? undefined : pointsToFraction(drift)) as number,
      // Empty boxes stay empty (null or undefined), so the schema answers "Enter …" for them.
      supply: values.settings.supply as PolicySettings['supply'],
    },
  };
}
