import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { growthDrift } from '@shared/clinical/growth';

describe('growth drift', () => {
  it('when 1.5 kg grows to 3 kg on 0.25 L/min of 100%, then effective FiO2 falls from 0.3417 to 0.2758', () => {
    // docs/clinical-sources.md §3.1 effective FiO2 table [X]: 1.5 kg → 0.3417, 3.0 kg → 0.2758 at 0.25 L/min, 100%
    const drift = growthDrift({ flowLpm: 0.25, sourceO2Percent: 100, approvedWeightKg: 1.5, newWeightKg: 3 });
    expect(drift.approvedEffectiveFio2).toBeCloseTo(0.3417, 4);
    expect(drift.currentEffectiveFio2).toBeCloseTo(0.2758, 4);
    expect(drift.driftFio2).toBeCloseTo(0.0658, 4);
    expect(drift.exceedsThreshold).toBe(true);
    // computed from flow × new/approved weight: doubling the weight doubles the flow, 0.5 L/min, an exact step
    expect(drift.restoringFlowLpm).toBeCloseTo(0.5, 12);
    expect(drift.restoringRoundedFlowLpm).toBe(0.5);
    expect(drift.restoredEffectiveFio2).toBeCloseTo(0.3417, 4);
  });

  it('when the gain is small, then the drift stays under the default 0.01 threshold', () => {
    // computed: 0.79 × 0.25 × (1/3 − 1/3.1) = 0.0021
    const drift = growthDrift({ flowLpm: 0.25, sourceO2Percent: 100, approvedWeightKg: 3, newWeightKg: 3.1 });
    expect(drift.driftFio2).toBeCloseTo(0.002124, 6);
    expect(drift.exceedsThreshold).toBe(false);
    expect(drift.restoringRoundedFlowLpm).toBe(0.275);
  });

  it('when a stricter threshold is set, then the same drift is reported', () => {
    const drift = growthDrift({
      flowLpm: 0.25,
      sourceO2Percent: 100,
      approvedWeightKg: 3,
      newWeightKg: 3.1,
      driftThresholdFio2: 0.002,
    });
    expect(drift.exceedsThreshold).toBe(true);
  });

  it('when the infant loses weight, then the drift is negative and still compared by size', () => {
    const drift = growthDrift({ flowLpm: 0.5, sourceO2Percent: 100, approvedWeightKg: 3, newWeightKg: 2.5 });
    expect(drift.driftFio2).toBeLessThan(0);
    expect(drift.exceedsThreshold).toBe(true);
    expect(drift.restoringFlowLpm as number).toBeLessThan(0.5);
  });

  it('when the restoring flow is above the largest step, then no rounded flow is given', () => {
    const drift = growthDrift({ flowLpm: 1.5, sourceO2Percent: 100, approvedWeightKg: 3, newWeightKg: 5 });
    expect(drift.restoringFlowLpm).toBeCloseTo(2.5, 12);
    expect(drift.restoringRoundedFlowLpm).toBeNull();
    expect(drift.restoredEffectiveFio2).toBeNull();
  });

  it('when weight rises, then drift is ≥ 0 and the rounded restoring flow is at least the old flow', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 6, noNaN: true }),
        fc.double({ min: 0, max: 3, noNaN: true }),
        fc.double({ min: 0.025, max: 0.5, noNaN: true }),
        (approvedWeightKg, gainKg, flowLpm) => {
          const newWeightKg = approvedWeightKg + gainKg;
          const drift = growthDrift({ flowLpm, sourceO2Percent: 100, approvedWeightKg, newWeightKg });
          expect(drift.driftFio2).toBeGreaterThanOrEqual(0);
          if (drift.restoringRoundedFlowLpm !== null) {
            expect(drift.restoringRoundedFlowLpm).toBeGreaterThanOrEqual(flowLpm - 1e-9);
            // the 1e-9 L/min rounding slack may leave the FiO2 a hair (≤ 1e-9) under the approved one
            expect(drift.restoredEffectiveFio2 as number).toBeGreaterThanOrEqual(drift.approvedEffectiveFio2 - 1e-9);
          }
        },
      ),
    );
  });
});
