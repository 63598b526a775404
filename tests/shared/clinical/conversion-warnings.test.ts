import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import type { PrescriptionConversionInput } from '@shared/clinical/conversion-types';
import { DEFAULT_FLOWMETER_STEPS_LPM } from '@shared/clinical/flowmeter';

const base: PrescriptionConversionInput = {
  weightKg: 3,
  flowLpm: 0.25,
  sourceO2Percent: 100,
  hospital: { elevationM: 0 },
  home: { elevationM: 1800 },
};

const convert = (extra: Partial<PrescriptionConversionInput>) => convertPrescription({ ...base, ...extra });
const codesOf = (extra: Partial<PrescriptionConversionInput>) => convert(extra).warnings.map((w) => w.code);

describe('prescription conversion: warnings and feasibility', () => {
  it('when the target is above the source purity, then it is not feasible and no flow is proposed', () => {
    // 2 kg on 1.5 L/min of a 93% concentrator: factor 0.75, effective 0.7553; at 3000 m the wet target is
    // 0.7553 × 713/478.95 = 1.12, above 0.93 (computed from §2.3 and §3.1 formulas)
    const result = convert({ weightKg: 2, flowLpm: 1.5, sourceO2Percent: 93, home: { elevationM: 3000 } });
    expect(result.feasible).toBe(false);
    expect(result.home.requiredFlowLpm).toBeNull();
    expect(result.home.roundedFlowLpm).toBeNull();
    expect(result.home.deliveredFio2).toBeNull();
    expect(result.warnings.map((w) => w.code)).toContain('TARGET_ABOVE_SOURCE');
    expect(result.home.targetFio2).toBeGreaterThan(0.93);
  });

  it('when the flow needed is above the largest step, then it is not feasible (never capped down)', () => {
    const result = convert({ flowmeterStepsLpm: [0.1, 0.2, 0.5] });
    expect(result.feasible).toBe(false);
    expect(result.home.roundedFlowLpm).toBeNull();
    expect(result.warnings.map((w) => w.code)).toContain('ABOVE_LARGEST_STEP');
  });

  it('when the rounded flow is above the cannula limit, then it is not feasible', () => {
    // 4 kg on 1.5 L/min at sea level → 3000 m needs about 2.75 L/min (computed from the §2.4 method)
    const stepsLpm = [...DEFAULT_FLOWMETER_STEPS_LPM, 2.5, 3, 3.5, 4];
    const result = convert({ weightKg: 4, flowLpm: 1.5, home: { elevationM: 3000 }, flowmeterStepsLpm: stepsLpm });
    expect(result.feasible).toBe(false);
    expect(result.home.roundedFlowLpm).toBeNull();
    expect(result.warnings.map((w) => w.code)).toContain('ABOVE_CANNULA_LIMIT');
    const raised = convert({
      weightKg: 4,
      flowLpm: 1.5,
      home: { elevationM: 3000 },
      flowmeterStepsLpm: stepsLpm,
      cannulaMaxFlowLpm: 4,
    });
    expect(raised.feasible).toBe(true);
    expect(raised.home.roundedFlowLpm).toBe(3);
  });

  it('when the home is higher than the hospital, then home air is flagged as poorer', () => {
    expect(codesOf({})).toContain('HOME_AIR_BELOW_HOSPITAL_AIR');
    expect(codesOf({})).not.toContain('HOME_AIR_ABOVE_HOSPITAL_AIR');
  });

  it('when the home is lower than the hospital, then the lower proposal is flagged', () => {
    const result = convert({ hospital: { elevationM: 1800 }, home: { elevationM: 0 } });
    expect(result.warnings.map((w) => w.code)).toContain('HOME_AIR_ABOVE_HOSPITAL_AIR');
    expect(result.home.requiredFlowLpm as number).toBeLessThan(0.25);
  });

  it('when a measured pressure is used on either side, then it is flagged', () => {
    expect(codesOf({ home: { pressureMmHg: 640 } })).toContain('MEASURED_PRESSURE_USED');
    expect(codesOf({ hospital: { pressureMmHg: 755 } })).toContain('MEASURED_PRESSURE_USED');
    expect(codesOf({})).not.toContain('MEASURED_PRESSURE_USED');
  });

  it('when the hospital flow is at or above the weight, then the capped factor is flagged', () => {
    // STOP-ROP: at LPM ≥ kg the infant inhales only cannula gas (§3.1)
    expect(codesOf({ weightKg: 1, flowLpm: 1, home: { elevationM: 0 } })).toContain('FACTOR_CAPPED');
    expect(codesOf({ weightKg: 1, flowLpm: 0.5, home: { elevationM: 0 } })).not.toContain('FACTOR_CAPPED');
    // a home flow rounded up to the weight is capped too: 0.99 L/min at 1 kg rounds to the 1 L/min step
    expect(codesOf({ weightKg: 1, flowLpm: 0.99, home: { elevationM: 0 } })).toContain('FACTOR_CAPPED');
  });

  it('when a capped hospital flow stays at the same elevation, then the hospital flow is kept, not cut', () => {
    // The model alone would propose 1 L/min (flow = weight gives the same factor 1 as 1.5 L/min)
    const result = convert({ weightKg: 1, flowLpm: 1.5, home: { elevationM: 0 } });
    expect(result.home.requiredFlowLpm).toBe(1.5);
    expect(result.home.roundedFlowLpm).toBe(1.5);
    expect(result.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['KEPT_HOSPITAL_FLOW', 'FACTOR_CAPPED']));
  });

  it('when the hospital gives room air only, then that is flagged and altitude alone may call for oxygen', () => {
    const same = convert({ flowLpm: 0, home: { elevationM: 0 } });
    expect(same.home.roundedFlowLpm).toBe(0);
    expect(same.home.deliveredFio2).toBe(0.21);
    expect(same.warnings.map((w) => w.code)).toContain('HOSPITAL_ON_ROOM_AIR');
    // wet rule: 0.21 × 713 / 564.26 = 0.2654 at 1800 m, which needs oxygen (computed from §2.3)
    const higher = convert({ flowLpm: 0 });
    expect(higher.home.targetFio2).toBeCloseTo(0.2654, 3);
    expect(higher.home.roundedFlowLpm as number).toBeGreaterThan(0);
  });

  it('when the hospital flow is above the cannula limit, then that is flagged', () => {
    expect(codesOf({ weightKg: 10, flowLpm: 2.5, home: { elevationM: 0 } })).toContain(
      'HOSPITAL_FLOW_ABOVE_CANNULA_LIMIT',
    );
  });

  it('when any warning is raised, then it has a plain message', () => {
    const result = convert({ weightKg: 1, flowLpm: 1.5, sourceO2Percent: 93, home: { pressureMmHg: 600 } });
    expect(result.warnings.length).toBeGreaterThan(2);
    for (const warning of result.warnings) expect(warning.message.length).toBeGreaterThan(20);
  });
});
