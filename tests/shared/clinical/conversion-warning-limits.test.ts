import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import { CONVERSION_WARNING_CODES, infeasibleReason, type ConversionWarning } from '@shared/clinical/conversion-warnings';
import type { PrescriptionConversionInput } from '@shared/clinical/conversion-types';

// Each warning at its limit: the last value that stays quiet beside the first that warns, and the words a
// consultant reads (docs/product-rules.md: show the cautions wherever a setting is shown; a warning with no words is no warning).
const base: PrescriptionConversionInput = { weightKg: 3, flowLpm: 0.25, sourceO2Percent: 100, hospital: { elevationM: 0 }, home: { elevationM: 0 } };
const warnings = (extra: Partial<PrescriptionConversionInput>) => convertPrescription({ ...base, ...extra }).warnings;
const find = (list: ConversionWarning[], code: string) => list.find((w) => w.code === code);

describe('conversion warnings at their limits', () => {
  it('when the hospital flow equals the 2 L/min cannula limit, then it is not flagged; above it, it is, with the limit named', () => {
    // Low-flow cannula ceiling 2 L/min (common practice; flowmeter.ts).
    expect(find(warnings({ weightKg: 10, flowLpm: 2 }), 'HOSPITAL_FLOW_ABOVE_CANNULA_LIMIT')).toBeUndefined();
    expect(find(warnings({ weightKg: 10, flowLpm: 2.25 }), 'HOSPITAL_FLOW_ABOVE_CANNULA_LIMIT')?.message).toBe('The hospital flow is above the 2 L/min low-flow cannula limit.');
  });

  it('when the hospital supply is room air (21 %), then it is flagged as room air even with a flow', () => {
    // A 21 % supply adds no oxygen whatever the flow (Benaron–Benitz mixing, docs/clinical-sources.md §3.1 [C]).
    expect(find(warnings({ sourceO2Percent: 21, homeSourceO2Percent: 100 }), 'HOSPITAL_ON_ROOM_AIR')?.message).toMatch(/room air only/);
    expect(find(warnings({ sourceO2Percent: 22 }), 'HOSPITAL_ON_ROOM_AIR')).toBeUndefined();
  });

  it('when home air is denser, then the warning says the proposal lowers the oxygen given', () => {
    expect(find(warnings({ hospital: { elevationM: 1800 } }), 'HOME_AIR_ABOVE_HOSPITAL_AIR')?.message).toBe(
      'Air pressure at home is higher than at the hospital, so the proposal lowers the oxygen given.',
    );
    expect(warnings({}).map((w) => w.code)).not.toContain('HOME_AIR_ABOVE_HOSPITAL_AIR');
  });

  it('when the hospital flow is just below the weight and home is not capped, then no capped-factor warning', () => {
    // STOP-ROP: the factor caps at flow ≥ weight (docs/clinical-sources.md §3.1 [C]); 0.9 L/min at 1 kg is below it.
    expect(find(warnings({ weightKg: 1, flowLpm: 0.9, hospital: { elevationM: 1000 } }), 'FACTOR_CAPPED')).toBeUndefined();
    expect(find(warnings({ weightKg: 1, flowLpm: 1 }), 'FACTOR_CAPPED')?.message).toMatch(/^A flow is at or above the weight in kg/);
  });

  it('when the target is above the supply, then the message gives both as percentages', () => {
    const list = warnings({ weightKg: 2, flowLpm: 1.5, sourceO2Percent: 93, home: { elevationM: 3000 } });
    expect(find(list, 'TARGET_ABOVE_SOURCE')?.message).toMatch(/^The home target FiO2 1\d\d\.\d% is above the home supply purity 93\.0%; no cannula flow can reach it\.$/);
  });

  it('when the hospital flow is kept at home, then the message says the proposal does not go below it', () => {
    expect(find(warnings({ weightKg: 1, flowLpm: 1.5 }), 'KEPT_HOSPITAL_FLOW')?.message).toBe(
      'Neither home air nor the home supply is richer, so the proposal does not go below the hospital flow.',
    );
  });

  it('when the rounded flow equals the cannula limit, then it is allowed; one step above, it is flagged', () => {
    // Same place, 4 kg on 2 L/min: needs exactly 2 L/min (equal pressures keep the flow).
    const at = warnings({ weightKg: 4, flowLpm: 2 });
    expect(find(at, 'ABOVE_CANNULA_LIMIT')).toBeUndefined();
    const over = convertPrescription({ ...base, weightKg: 4, flowLpm: 2, home: { elevationM: 1000 }, flowmeterStepsLpm: [1, 2, 2.5, 3] });
    expect(over.feasible).toBe(false);
    expect(find(over.warnings, 'ABOVE_CANNULA_LIMIT')?.message).toMatch(/^The flow needed \(2\.5 L\/min at the next flowmeter step\) is above the 2 L\/min low-flow cannula limit\.$/);
    expect(find(over.warnings, 'ROUNDED_UP_TO_STEP')).toBeUndefined();
  });

  it('when a flow lands exactly on a step, then nothing is said about rounding; between steps, the step is named', () => {
    expect(find(warnings({}), 'ROUNDED_UP_TO_STEP')).toBeUndefined();
    expect(find(warnings({ home: { elevationM: 1800 } }), 'ROUNDED_UP_TO_STEP')?.message).toBe('The flow was rounded up to the next flowmeter step (0.55 L/min), never down.');
  });

  it('when the weight is at the ends of the STOP-ROP table (0.7 and 4 kg), then it is inside; beyond, it is flagged', () => {
    // STOP-ROP Table 1 columns run 0.7 to 4 kg (docs/clinical-sources.md §3.1 [C]).
    expect(find(warnings({ weightKg: 0.7, flowLpm: 0.1 }), 'WEIGHT_OUTSIDE_MODEL_TABLE')).toBeUndefined();
    expect(find(warnings({ weightKg: 4 }), 'WEIGHT_OUTSIDE_MODEL_TABLE')).toBeUndefined();
    expect(find(warnings({ weightKg: 0.69, flowLpm: 0.1 }), 'WEIGHT_OUTSIDE_MODEL_TABLE')?.message).toMatch(/^The weight 0\.69 kg is outside the 0\.7–4 kg range/);
    expect(find(warnings({ weightKg: 4.01 }), 'WEIGHT_OUTSIDE_MODEL_TABLE')).toBeDefined();
  });

  it('when above the largest step but within the cannula, then the message says so', () => {
    const list = warnings({ home: { elevationM: 1800 }, flowmeterStepsLpm: [0.1, 0.2, 0.5] });
    expect(find(list, 'ABOVE_LARGEST_STEP')?.message).toMatch(/^The flow needed \(0\.52\d L\/min\) is above the programme's largest flowmeter step \(0\.5 L\/min\), though within the 2 L\/min cannula limit\.$/);
  });

  it('when a proposal is not feasible, then the reason names the limit that stops it, most basic first', () => {
    const w = (...codes: string[]) => codes.map((code) => ({ code, message: 'm' }) as ConversionWarning);
    expect(infeasibleReason(w('ABOVE_CANNULA_LIMIT', 'TARGET_ABOVE_SOURCE'))).toMatch(/above the oxygen supply’s purity/);
    expect(infeasibleReason(w('ABOVE_CANNULA_LIMIT', 'ABOVE_LARGEST_STEP'))).toMatch(/largest flowmeter step/);
    expect(infeasibleReason(w('ABOVE_CANNULA_LIMIT'))).toMatch(/low-flow cannula limit/);
    expect(infeasibleReason(w())).toBe('No setting on the programme’s equipment reaches the target at home.');
  });

  it('when the flow is rounded up to exactly the cannula limit, then the rounding is still reported', () => {
    // Same place, 4 kg on 1.5 L/min with meter steps 1 and 2 L/min: 1.5 is rounded up to 2, the 2 L/min limit itself.
    const result = convertPrescription({ ...base, weightKg: 4, flowLpm: 1.5, flowmeterStepsLpm: [1, 2] });
    expect(result.feasible).toBe(true);
    expect(find(result.warnings, 'ROUNDED_UP_TO_STEP')?.message).toBe('The flow was rounded up to the next flowmeter step (2 L/min), never down.');
  });

  it('when the flow is beyond both the largest step and the cannula, then the message does not call it within the cannula', () => {
    // 4 kg on 1.5 L/min at sea level → 3000 m needs about 2.75 L/min (see conversion-warnings.test.ts, computed).
    const list = warnings({ weightKg: 4, flowLpm: 1.5, home: { elevationM: 3000 }, flowmeterStepsLpm: [1, 2] });
    expect(find(list, 'ABOVE_LARGEST_STEP')?.message).toMatch(/^The flow needed \(2\.7\d+ L\/min\) is above the programme's largest flowmeter step \(2 L\/min\)\.$/);
    for (const w of list) {
      expect(CONVERSION_WARNING_CODES).toContain(w.code);
      expect(w.message.length).toBeGreaterThan(20);
    }
  });
});

