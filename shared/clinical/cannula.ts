// Room air oxygen fraction as used by the STOP-ROP tables (most calculators use 0.21; physiology texts 0.2093).
// The same value must be used forwards and inverted, or inverse ∘ forward would not be the identity.
export const ROOM_AIR_FIO2 = 0.21;

export const CANNULA_MODEL = {
  name: 'Benaron–Benitz low-flow cannula model as tabulated by STOP-ROP',
  version: 'Arch Pediatr Adolesc Med 1994;148:294; STOP-ROP tables (Ti 0.3 s, VT 5 mL/kg)',
} as const;

function assertWeight(weightKg: number): void {
  if (!Number.isFinite(weightKg) || weightKg <= 0) throw new RangeError(`Weight ${weightKg} kg must be positive`);
}

function assertFraction(fraction: number, name: string): void {
  if (!Number.isFinite(fraction) || fraction < ROOM_AIR_FIO2 || fraction > 1) {
    throw new RangeError(`${name} ${fraction} must lie between 0.21 and 1`);
  }
}

/**
 * Share of each breath drawn from the cannula: flow over a 0.3 s inspiration (5 mL per L/min) against a 5 mL/kg
 * tidal volume, so flow/kg; at flow ≥ weight the whole breath is cannula gas (STOP-ROP Table 1).
 */
export function cannulaFactor(flowLpm: number, weightKg: number): number {
  assertWeight(weightKg);
  if (!Number.isFinite(flowLpm) || flowLpm < 0) throw new RangeError(`Flow ${flowLpm} L/min must be 0 or more`);
  return Math.min(1, flowLpm / weightKg);
}

/**
 * STOP-ROP Table 1 cell: round-half-up of 100 × min(1, flow/kg). Math.round rounds halves up for positives, which
 * the table needs (1/8 L/min at 1 kg is printed 13, not the banker's 12). The flow must be the exact fraction
 * (1/32, not the printed 0.03), as docs/clinical-sources.md §3.1 shows.
 */
export function stopRopTableFactorPercent(flowLpm: number, weightKg: number): number {
  return Math.round(100 * cannulaFactor(flowLpm, weightKg));
}

/** Effective FiO2 = 0.21 + factor × (source − 0.21): cannula gas and entrained room air mixed by volume. */
export function effectiveFio2(flowLpm: number, weightKg: number, sourceFraction: number): number {
  assertFraction(sourceFraction, 'Source oxygen fraction');
  return ROOM_AIR_FIO2 + cannulaFactor(flowLpm, weightKg) * (sourceFraction - ROOM_AIR_FIO2);
}

// A target carried through a pressure ratio of exactly 1 can come back one float step above the source purity;
// that is noise, not an unreachable target.
const FIO2_TOLERANCE = 1e-12;

export type FlowForTarget =
  | { feasible: true; flowLpm: number; factor: number }
  | { feasible: false; flowLpm: null; factor: null };

/**
 * Inverse of effectiveFio2. No cannula flow can exceed the source purity, so such a target is infeasible; a target
 * at or below room air needs no flow. At target = source the answer is flow = weight, the least flow that fills
 * the breath.
 */
export function flowForEffectiveFio2(targetFio2: number, weightKg: number, sourceFraction: number): FlowForTarget {
  assertWeight(weightKg);
  assertFraction(sourceFraction, 'Source oxygen fraction');
  if (!Number.isFinite(targetFio2)) throw new RangeError(`Target FiO2 ${targetFio2} is not a number`);
  if (targetFio2 <= ROOM_AIR_FIO2) return { feasible: true, flowLpm: 0, factor: 0 };
  if (targetFio2 > sourceFraction + FIO2_TOLERANCE) return { feasible: false, flowLpm: null, factor: null };
  const factor = Math.min(1, (targetFio2 - ROOM_AIR_FIO2) / (sourceFraction - ROOM_AIR_FIO2));
  return { feasible: true, flowLpm: factor * weightKg, factor };
}
