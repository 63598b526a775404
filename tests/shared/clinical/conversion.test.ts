import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import type { PrescriptionConversionInput } from '@shared/clinical/conversion-types';
import { DEFAULT_FLOWMETER_STEPS_LPM } from '@shared/clinical/flowmeter';
import { westPressureMmHg } from '@shared/clinical/pressure';

const codes = (input: PrescriptionConversionInput) => convertPrescription(input).warnings.map((w) => w.code);

const seaLevelTo = (home: PrescriptionConversionInput['home'], extra: Partial<PrescriptionConversionInput> = {}) => ({
  weightKg: 3,
  flowLpm: 0.25,
  sourceO2Percent: 100,
  hospital: { elevationM: 0 },
  home,
  ...extra,
});

describe('prescription conversion: worked examples', () => {
  it('when 3 kg on 0.25 L/min of 100% goes from sea level to 1800 m, then 0.526 L/min is needed', () => {
    // docs/clinical-sources.md §2.4 worked example [X]: effective 0.2758, target 0.2758 × 713 / 564.22 = 0.3486,
    // flow 0.526 L/min. The example uses the geopotential-table pressure 611.22 mmHg, given here as measured.
    const result = convertPrescription(seaLevelTo({ pressureMmHg: 611.22 }));
    expect(result.hospital.effectiveFio2).toBeCloseTo(0.2758, 4);
    expect(result.home.targetFio2).toBeCloseTo(0.3486, 4);
    expect(result.home.requiredFlowLpm).toBeCloseTo(0.526, 3);
    expect(result.home.roundedFlowLpm).toBe(0.55);
    expect(result.feasible).toBe(true);
  });

  it('when the same journey is entered as a geometric elevation, then the flow still rounds to 0.526', () => {
    // §2.4 [X]; geometric 1800 m gives 611.26 mmHg, 0.04 mmHg above the geopotential figure
    const result = convertPrescription(seaLevelTo({ elevationM: 1800 }));
    expect(result.home.requiredFlowLpm).toBeCloseTo(0.526, 3);
  });

  it('when 2 kg on 0.1 L/min of 100% goes to 2438.4 m, then 0.339 L/min is needed', () => {
    // §2.4 other cases [X] (geopotential pressure 564.51 mmHg from §1.2)
    const result = convertPrescription(seaLevelTo({ pressureMmHg: 564.51 }, { weightKg: 2, flowLpm: 0.1 }));
    expect(result.home.requiredFlowLpm).toBeCloseTo(0.339, 3);
    const byElevation = convertPrescription(seaLevelTo({ elevationM: 2438.4 }, { weightKg: 2, flowLpm: 0.1 }));
    expect(Math.abs((byElevation.home.requiredFlowLpm as number) - 0.339)).toBeLessThan(0.001);
    expect(byElevation.home.roundedFlowLpm).toBe(0.35);
  });

  it('when 4 kg on 0.5 L/min of 100% goes to 2000 m, then 0.966 L/min is needed', () => {
    // §2.4 other cases [X]
    const result = convertPrescription(seaLevelTo({ elevationM: 2000 }, { weightKg: 4, flowLpm: 0.5 }));
    expect(result.home.requiredFlowLpm).toBeCloseTo(0.966, 3);
    expect(result.home.roundedFlowLpm).toBe(0.975);
  });

  it('when a flow is rounded up, then the delivered FiO2 is at least the target and PIO2 is kept', () => {
    const result = convertPrescription(seaLevelTo({ elevationM: 1800 }));
    // computed from 0.21 + (0.55/3) × 0.79 = 0.35483
    expect(result.home.deliveredFio2).toBeCloseTo(0.354833, 6);
    expect(result.home.deliveredFio2 as number).toBeGreaterThanOrEqual(result.home.targetFio2);
    expect(result.home.pio2MmHg).toBeCloseTo(result.hospital.pio2MmHg, 10);
    expect(codes(seaLevelTo({ elevationM: 1800 }))).toContain('ROUNDED_UP_TO_STEP');
  });

  it('when hospital and home are at the same elevation, then the hospital flow is proposed unchanged', () => {
    const result = convertPrescription(seaLevelTo({ elevationM: 0 }));
    expect(result.home.roundedFlowLpm).toBe(0.25);
    expect(result.home.deliveredFio2).toBeCloseTo(result.hospital.effectiveFio2, 12);
    expect(codes(seaLevelTo({ elevationM: 0 }))).toEqual([]);
  });

  it('when feet are entered, then the result equals the same height in metres', () => {
    const byFeet = convertPrescription(seaLevelTo({ elevationFt: 5000 }));
    const byMetres = convertPrescription(seaLevelTo({ elevationM: 1524 }));
    expect(byFeet.home).toEqual(byMetres.home);
  });
});

describe('prescription conversion: a different supply at home', () => {
  it('when the home supply is a 95% concentrator, then the flow is found against 95%, not 100%', () => {
    // §2.4 method with the home supply purity: target 0.3485 at 1800 m (geometric 611.26 mmHg);
    // factor (0.3485 − 0.21)/(0.95 − 0.21) = 0.1872, × 3 kg = 0.5617 L/min (computed from §3.1 formulas)
    const result = convertPrescription(seaLevelTo({ elevationM: 1800 }, { homeSourceO2Percent: 95 }));
    expect(result.hospital.effectiveFio2).toBeCloseTo(0.2758, 4);
    expect(result.home.requiredFlowLpm).toBeCloseTo(0.5617, 4);
    expect(result.home.roundedFlowLpm).toBe(0.575);
    expect(result.home.deliveredFio2).toBeCloseTo(0.21 + (0.575 / 3) * 0.74, 12);
  });

  it('when the home supply is purer at the same elevation, then the flow may go below the hospital flow', () => {
    // hospital 0.5 L/min of a 60% blend at 2 kg: effective 0.21 + 0.25 × 0.39 = 0.3075; on 100% at home that needs
    // (0.3075 − 0.21)/0.79 × 2 kg = 0.2468 L/min (computed from §3.1 formulas)
    const result = convertPrescription(
      seaLevelTo({ elevationM: 0 }, { weightKg: 2, flowLpm: 0.5, sourceO2Percent: 60, homeSourceO2Percent: 100 }),
    );
    expect(result.home.requiredFlowLpm).toBeCloseTo((0.25 * 0.39 * 2) / 0.79, 12);
    expect(result.warnings.map((w) => w.code)).not.toContain('KEPT_HOSPITAL_FLOW');
  });

  it('when the home supply cannot reach the target, then it is not feasible and the home purity is named', () => {
    const result = convertPrescription(
      seaLevelTo({ elevationM: 2000 }, { weightKg: 1, flowLpm: 1, sourceO2Percent: 100, homeSourceO2Percent: 90 }),
    );
    expect(result.feasible).toBe(false);
    const warning = result.warnings.find((w) => w.code === 'TARGET_ABOVE_SOURCE');
    expect(warning?.message).toContain('90.0%');
  });
});

describe('prescription conversion: models and options', () => {
  it('when no options are given, then ISA, the cannula model, the wet rule and 47 mmHg are named', () => {
    const { model } = convertPrescription(seaLevelTo({ elevationM: 1000 }));
    expect(model.pressure.version).toBe('U.S. Standard Atmosphere 1976');
    expect(model.cannula.name).toContain('STOP-ROP');
    expect(model.equivalence).toBe('wet PIO2-constant');
    expect(model.waterVapourMmHg).toBe(47);
    expect(model.version).toMatch(/^nestflow-conversion-\d+\.\d+\.\d+$/);
  });

  it('when the West model is chosen, then it gives the home pressure and is named', () => {
    const result = convertPrescription(seaLevelTo({ elevationM: 3000 }, { pressureModel: 'west-1996' }));
    expect(result.home.pressureMmHg).toBe(westPressureMmHg(3000));
    expect(result.model.pressure.version).toContain('West');
  });

  it('when the water vapour pressure is changed, then PIO2 uses it', () => {
    // ADC Table 1 footnote uses 47.1 mmHg (§2.1)
    const result = convertPrescription(seaLevelTo({ elevationM: 0 }, { flowLpm: 0, waterVapourMmHg: 47.1 }));
    expect(result.hospital.pio2MmHg).toBeCloseTo(0.21 * (760 - 47.1), 10);
    expect(result.model.waterVapourMmHg).toBe(47.1);
  });

  it('when the inputs are out of range, then they are refused', () => {
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { weightKg: 0 }))).toThrow(RangeError);
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { flowLpm: -1 }))).toThrow(RangeError);
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { sourceO2Percent: 20 }))).toThrow(RangeError);
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { homeSourceO2Percent: 101 }))).toThrow(RangeError);
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { homeSourceO2Percent: 20 }))).toThrow(RangeError);
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { sourceO2Percent: 101 }))).toThrow(RangeError);
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { weightKg: Number.NaN }))).toThrow(RangeError);
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { cannulaMaxFlowLpm: 0 }))).toThrow('The cannula limit must be above 0 L/min');
    expect(() => convertPrescription(seaLevelTo({ elevationM: 0 }, { flowmeterStepsLpm: [0.5, 0.1] }))).toThrow(
      RangeError,
    );
  });

  it('when steps are not given, then the programme defaults are used', () => {
    const withDefault = convertPrescription(seaLevelTo({ elevationM: 1800 }));
    const steps = { flowmeterStepsLpm: DEFAULT_FLOWMETER_STEPS_LPM };
    const explicit = convertPrescription(seaLevelTo({ elevationM: 1800 }, steps));
    expect(withDefault).toEqual(explicit);
  });
});
