// Cylinder factors in L per psi from the "Oxygen Cylinder Guidance" sheet (Virginia EMS, 2010), as listed in
// docs/clinical-sources.md §7. Real cylinders differ by model and fill pressure; a programme should store the factor of
// the cylinders its supplier delivers.
export const US_CYLINDER_FACTORS_L_PER_PSI = { D: 0.16, E: 0.28, M: 1.56, 'H/K': 3.14 } as const;

// Safe residual left in a cylinder so it is changed before it runs dry (same sheet).
export const DEFAULT_SAFE_RESIDUAL_PSI = 200;

export interface PsiDurationInput {
  gaugePsi: number;
  cylinderFactorLPerPsi: number;
  flowLpm: number;
  residualPsi?: number;
}

function assertNonNegative(value: number, name: string): void {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be 0 or more`);
}

/**
 * Null at zero flow: nothing is being used, so there is no duration to show, and a division would give Infinity,
 * which does not survive JSON. A gauge at or below the residual gives 0, never a negative time.
 */
function minutesFromUsableLitres(usableL: number, flowLpm: number): number | null {
  assertNonNegative(flowLpm, 'Flow');
  if (flowLpm === 0) return null;
  return Math.max(0, usableL) / flowLpm;
}

/** minutes = (gauge − residual) × factor ÷ flow. */
export function cylinderMinutesFromPsi(input: PsiDurationInput): number | null {
  const residualPsi = input.residualPsi ?? DEFAULT_SAFE_RESIDUAL_PSI;
  assertNonNegative(input.gaugePsi, 'Gauge pressure');
  assertNonNegative(input.cylinderFactorLPerPsi, 'Cylinder factor');
  assertNonNegative(residualPsi, 'Residual pressure');
  return minutesFromUsableLitres((input.gaugePsi - residualPsi) * input.cylinderFactorLPerPsi, input.flowLpm);
}

export interface MetricDurationInput {
  waterCapacityL: number;
  gaugeBar: number;
  flowLpm: number;
  /** No hidden default: programmes differ, and the check values use 0. */
  residualBar: number;
  /**
   * Gas contents per ideal litre; 1 is the ideal-gas estimate. A supplier gives about 1.07 for oxygen at 200 bar
   * (docs/clinical-sources.md §7), i.e. the reciprocal of the gas's compressibility factor.
   */
  compressibilityMultiplier?: number;
}

/** Litres ≈ water capacity × (gauge − residual) bar × multiplier; minutes = litres ÷ flow. */
export function cylinderMinutesFromBar(input: MetricDurationInput): number | null {
  const multiplier = input.compressibilityMultiplier ?? 1;
  assertNonNegative(input.waterCapacityL, 'Water capacity');
  assertNonNegative(input.gaugeBar, 'Gauge pressure');
  assertNonNegative(input.residualBar, 'Residual pressure');
  if (!(multiplier > 0)) throw new RangeError('Compressibility multiplier must be positive');
  const usableL = input.waterCapacityL * (input.gaugeBar - input.residualBar) * multiplier;
  return minutesFromUsableLitres(usableL, input.flowLpm);
}

/** Usable share left above the residual, 0..1, e.g. for a "change soon" prompt. */
export function cylinderRemainingFraction(gaugePsi: number, fullPsi: number, residualPsi = DEFAULT_SAFE_RESIDUAL_PSI) {
  if (!(fullPsi > residualPsi)) throw new RangeError('Full pressure must be above the residual');
  return Math.min(1, Math.max(0, (gaugePsi - residualPsi) / (fullPsi - residualPsi)));
}

export interface JourneySupplyInput {
  journeyHours: number;
  /** Usable minutes one full cylinder gives at the journey flow. */
  minutesPerCylinder: number;
  /** Extra supply as a share of the journey need (0.5 = half as much again); a programme decision. */
  reserveFraction: number;
}

// Slack for float noise only, so an exact 2 cylinders is not reported as 3.
const COUNT_TOLERANCE = 1e-9;

/** Whole cylinders, rounded up: a part cylinder cannot be carried, and running short is the harm to avoid. */
export function cylindersForJourney(input: JourneySupplyInput): number {
  assertNonNegative(input.journeyHours, 'Journey length');
  assertNonNegative(input.reserveFraction, 'Reserve');
  if (!(input.minutesPerCylinder > 0)) throw new RangeError('A cylinder must last more than 0 minutes');
  const neededMinutes = input.journeyHours * 60 * (1 + input.reserveFraction);
  const count = Math.ceil(neededMinutes / input.minutesPerCylinder - COUNT_TOLERANCE);
  // Any real need, however short, takes a whole cylinder; the tolerance must not round it to none.
  return neededMinutes > 0 ? Math.max(1, count) : 0;
}
