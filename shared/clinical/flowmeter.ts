function stepsFromMillilitres(fromMl: number, toMl: number, stepMl: number): number[] {
  const steps: number[] = [];
  for (let ml = fromMl; ml <= toMl; ml += stepMl) steps.push(ml / 1000);
  return steps;
}

/**
 * Programme default (common practice for infant low-flow meters): 0.025 L/min steps to 1 L/min, then 0.25 L/min
 * steps to 2 L/min. Built from whole millilitres so 0.025 × 10 is exactly 0.25, not 0.25000000000000006.
 */
export const DEFAULT_FLOWMETER_STEPS_LPM: readonly number[] = Object.freeze([
  ...stepsFromMillilitres(25, 1000, 25),
  ...stepsFromMillilitres(1250, 2000, 250),
]);

// Low-flow cannula ceiling (common practice; Jensen 2019 also grades above 2 L/min as a different support level).
export const DEFAULT_CANNULA_MAX_FLOW_LPM = 2;

// Absolute slack for float noise only: a requirement of 0.25000000001 L/min is 0.25, but anything a flowmeter could
// tell apart (the finest real steps are millilitres) is still rounded up.
export const FLOW_TOLERANCE_LPM = 1e-9;

export function assertValidSteps(stepsLpm: readonly number[]): void {
  if (stepsLpm.length === 0) throw new RangeError('At least one flowmeter step is needed');
  stepsLpm.forEach((stepLpm, index) => {
    if (!Number.isFinite(stepLpm) || stepLpm <= 0) throw new RangeError(`Step ${stepLpm} L/min must be positive`);
    if (index > 0 && stepLpm <= stepsLpm[index - 1]) throw new RangeError('Flowmeter steps must be ascending');
  });
}

/**
 * Never round a dose down: the smallest step at or above the requirement. Null when the requirement is above the
 * largest step, so the caller must say the setting cannot be delivered rather than quietly capping it. Zero stays
 * zero (no oxygen needed); it is not a flowmeter position.
 */
export function roundUpToStepLpm(requiredFlowLpm: number, stepsLpm: readonly number[]): number | null {
  assertValidSteps(stepsLpm);
  if (!Number.isFinite(requiredFlowLpm) || requiredFlowLpm < 0) {
    throw new RangeError(`Required flow ${requiredFlowLpm} L/min must be 0 or more`);
  }
  if (requiredFlowLpm === 0) return 0;
  for (const stepLpm of stepsLpm) {
    if (stepLpm >= requiredFlowLpm - FLOW_TOLERANCE_LPM) return stepLpm;
  }
  return null;
}
