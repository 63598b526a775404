import { effectiveFio2, flowForEffectiveFio2 } from './cannula';
import { DEFAULT_FLOWMETER_STEPS_LPM, roundUpToStepLpm } from './flowmeter';

// One percentage point of effective FiO2: below the 2-point steps used in room-air challenges (Walsh 2003,
// docs/clinical-sources.md §3.3), so drift is reported before it reaches a clinically tested step. A programme choice.
export const DEFAULT_DRIFT_THRESHOLD_FIO2 = 0.01;

export interface GrowthDriftInput {
  flowLpm: number;
  sourceO2Percent: number;
  /** Weight at which the current flow was approved. */
  approvedWeightKg: number;
  newWeightKg: number;
  flowmeterStepsLpm?: readonly number[];
  driftThresholdFio2?: number;
}

export interface GrowthDrift {
  approvedEffectiveFio2: number;
  currentEffectiveFio2: number;
  /** Approved minus current: positive when the infant has outgrown the flow and now gets less oxygen. */
  driftFio2: number;
  /** True when the drift in either direction reaches the threshold. */
  exceedsThreshold: boolean;
  /** Flow restoring the approved effective FiO2 at the new weight; null only if the source cannot reach it. */
  restoringFlowLpm: number | null;
  /** Rounded up to a flowmeter step, never down; null when above the largest step. */
  restoringRoundedFlowLpm: number | null;
  restoredEffectiveFio2: number | null;
}

/**
 * A fixed flow gives a growing infant less oxygen: the cannula factor is flow ÷ weight, so the same flow fills a
 * smaller share of a larger breath (STOP-ROP model). Weight loss gives the opposite drift.
 */
export function growthDrift(input: GrowthDriftInput): GrowthDrift {
  const sourceFraction = input.sourceO2Percent / 100;
  const threshold = input.driftThresholdFio2 ?? DEFAULT_DRIFT_THRESHOLD_FIO2;
  const approvedEffectiveFio2 = effectiveFio2(input.flowLpm, input.approvedWeightKg, sourceFraction);
  const currentEffectiveFio2 = effectiveFio2(input.flowLpm, input.newWeightKg, sourceFraction);
  const driftFio2 = approvedEffectiveFio2 - currentEffectiveFio2;
  const restoring = flowForEffectiveFio2(approvedEffectiveFio2, input.newWeightKg, sourceFraction);
  const steps = input.flowmeterStepsLpm ?? DEFAULT_FLOWMETER_STEPS_LPM;
  const rounded = restoring.flowLpm === null ? null : roundUpToStepLpm(restoring.flowLpm, steps);
  return {
    approvedEffectiveFio2,
    currentEffectiveFio2,
    driftFio2,
    // A tiny slack so a drift computed as 0.00999999999 from an exact 0.01 still counts.
    exceedsThreshold: Math.abs(driftFio2) >= threshold - 1e-12,
    restoringFlowLpm: restoring.flowLpm,
    restoringRoundedFlowLpm: rounded,
    restoredEffectiveFio2: rounded === null ? null : effectiveFio2(rounded, input.newWeightKg, sourceFraction),
  };
}
