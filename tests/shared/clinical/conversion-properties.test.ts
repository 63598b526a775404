import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { convertPrescription } from '@shared/clinical/conversion';
import { DEFAULT_FLOWMETER_STEPS_LPM } from '@shared/clinical/flowmeter';

// Steps to 15 L/min and a matching cannula limit, so only the physics (target above source) can make a case infeasible.
const EXTRA_STEPS_LPM = Array.from({ length: 52 }, (_, i) => (2250 + 250 * i) / 1000);
const WIDE_STEPS_LPM = [...DEFAULT_FLOWMETER_STEPS_LPM, ...EXTRA_STEPS_LPM];

const prescription = fc.record({
  weightKg: fc.double({ min: 0.5, max: 15, noNaN: true }),
  flowLpm: fc.double({ min: 0, max: 2, noNaN: true }),
  sourceO2Percent: fc.double({ min: 21, max: 100, noNaN: true }),
  hospitalM: fc.double({ min: -500, max: 6000, noNaN: true }),
});

const elevationM = fc.double({ min: -500, max: 6000, noNaN: true });

describe('prescription conversion: properties', () => {
  it('when the home is higher, then the proposed flow is never lower', () => {
    fc.assert(
      fc.property(prescription, elevationM, fc.double({ min: 0, max: 3000, noNaN: true }), (p, lowM, riseM) => {
        const highM = Math.min(6000, lowM + riseM);
        const convert = (homeM: number) =>
          convertPrescription({
            weightKg: p.weightKg,
            flowLpm: p.flowLpm,
            sourceO2Percent: p.sourceO2Percent,
            hospital: { elevationM: p.hospitalM },
            home: { elevationM: homeM },
            flowmeterStepsLpm: WIDE_STEPS_LPM,
            cannulaMaxFlowLpm: 15,
          });
        const low = convert(lowM);
        const high = convert(highM);
        if (high.feasible) {
          expect(low.feasible).toBe(true);
          expect(high.home.roundedFlowLpm as number).toBeGreaterThanOrEqual(low.home.roundedFlowLpm as number);
          const lowRequiredLpm = low.home.requiredFlowLpm as number;
          expect(high.home.requiredFlowLpm as number).toBeGreaterThanOrEqual(lowRequiredLpm - 1e-9);
        }
      }),
    );
  });

  it('when a flow is proposed, then it is ≥ the requirement, < one step above it, and meets the target', () => {
    fc.assert(
      fc.property(prescription, elevationM, (p, homeM) => {
        const result = convertPrescription({
          weightKg: p.weightKg,
          flowLpm: p.flowLpm,
          sourceO2Percent: p.sourceO2Percent,
          hospital: { elevationM: p.hospitalM },
          home: { elevationM: homeM },
        });
        if (!result.feasible) return;
        const required = result.home.requiredFlowLpm as number;
        const rounded = result.home.roundedFlowLpm as number;
        expect(rounded).toBeGreaterThanOrEqual(required - 1e-9);
        const index = DEFAULT_FLOWMETER_STEPS_LPM.indexOf(rounded);
        const previous = index > 0 ? DEFAULT_FLOWMETER_STEPS_LPM[index - 1] : 0;
        if (rounded > 0) expect(rounded - required).toBeLessThan(rounded - previous + 1e-9);
        expect(result.home.deliveredFio2 as number).toBeGreaterThanOrEqual(result.home.targetFio2 - 1e-9);
      }),
    );
  });

  it('when the home is at or above the hospital elevation, then the proposal is never below the hospital flow', () => {
    fc.assert(
      fc.property(prescription, fc.double({ min: 0, max: 2000, noNaN: true }), (p, riseM) => {
        const result = convertPrescription({
          weightKg: p.weightKg,
          flowLpm: p.flowLpm,
          sourceO2Percent: p.sourceO2Percent,
          hospital: { elevationM: p.hospitalM },
          home: { elevationM: Math.min(6000, p.hospitalM + riseM) },
          flowmeterStepsLpm: WIDE_STEPS_LPM,
          cannulaMaxFlowLpm: 15,
        });
        if (!result.feasible) return;
        expect(result.home.requiredFlowLpm as number).toBeGreaterThanOrEqual(p.flowLpm);
        expect(result.home.roundedFlowLpm as number).toBeGreaterThanOrEqual(p.flowLpm - 1e-9);
      }),
    );
  });

  it('when home and hospital are the same place, then the conversion is always feasible within the steps', () => {
    fc.assert(
      fc.property(prescription, (p) => {
        const result = convertPrescription({
          weightKg: p.weightKg,
          flowLpm: p.flowLpm,
          sourceO2Percent: p.sourceO2Percent,
          hospital: { elevationM: p.hospitalM },
          home: { elevationM: p.hospitalM },
          flowmeterStepsLpm: WIDE_STEPS_LPM,
          cannulaMaxFlowLpm: 15,
        });
        expect(result.feasible).toBe(true);
        expect(result.home.deliveredFio2 as number).toBeGreaterThanOrEqual(result.hospital.effectiveFio2 - 1e-12);
      }),
    );
  });
});
