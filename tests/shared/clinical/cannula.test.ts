import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  cannulaFactor,
  effectiveFio2,
  flowForEffectiveFio2,
  stopRopTableFactorPercent,
} from '@shared/clinical/cannula';

// STOP-ROP Table 1 (docs/clinical-sources.md §3.1) [C "STOP-ROP Effective FiO2 Conversion Tables for Infants on Nasal
// Cannula"]. Rows are flows as the exact fractions the sheet means (the printed 0.03 is 1/32); columns are kg.
const WEIGHTS_KG = [0.7, 1, 1.25, 1.5, 2, 2.5, 3, 3.5, 4];
const TABLE_1: [string, number, number[]][] = [
  ['1/100', 1 / 100, [1, 1, 1, 1, 1, 0, 0, 0, 0]],
  ['1/32', 1 / 32, [4, 3, 3, 2, 2, 1, 1, 1, 1]],
  ['1/16', 1 / 16, [9, 6, 5, 4, 3, 3, 2, 2, 2]],
  ['1/8', 1 / 8, [18, 13, 10, 8, 6, 5, 4, 4, 3]],
  ['3/20', 3 / 20, [21, 15, 12, 10, 8, 6, 5, 4, 4]],
  ['1/4', 1 / 4, [36, 25, 20, 17, 13, 10, 8, 7, 6]],
  ['1/2', 1 / 2, [71, 50, 40, 33, 25, 20, 17, 14, 13]],
  ['3/4', 3 / 4, [100, 75, 60, 50, 38, 30, 25, 21, 19]],
  ['1', 1, [100, 100, 80, 67, 50, 40, 33, 29, 25]],
  ['1.25', 1.25, [100, 100, 100, 83, 63, 50, 42, 36, 31]],
  ['1.5', 1.5, [100, 100, 100, 100, 75, 60, 50, 43, 38]],
  ['2', 2, [100, 100, 100, 100, 100, 80, 67, 57, 50]],
  ['3', 3, [100, 100, 100, 100, 100, 100, 100, 86, 75]],
  ['4', 4, [100, 100, 100, 100, 100, 100, 100, 100, 100]],
  ['5', 5, [100, 100, 100, 100, 100, 100, 100, 100, 100]],
  ['6', 6, [100, 100, 100, 100, 100, 100, 100, 100, 100]],
];

describe('STOP-ROP Table 1 factor', () => {
  it('when every one of the 144 cells is computed, then all match the published table', () => {
    // STOP-ROP Table 1 [C]; docs/clinical-sources.md §3.1 reproduction: 0 mismatches with round-half-up
    const mismatches: string[] = [];
    let cells = 0;
    for (const [label, flowLpm, expected] of TABLE_1) {
      WEIGHTS_KG.forEach((weightKg, column) => {
        cells += 1;
        const actual = stopRopTableFactorPercent(flowLpm, weightKg);
        if (actual !== expected[column]) mismatches.push(`${label} L/min at ${weightKg} kg gave ${actual}`);
      });
    }
    expect(cells).toBe(144);
    expect(mismatches).toEqual([]);
  });

  it('when 1/8 L/min at 1 kg gives exactly 12.5, then the cell rounds half up to 13', () => {
    // §10 #16: Table 1 prints 13 [C]; banker's rounding would give 12 (§3.1)
    expect(cannulaFactor(1 / 8, 1)).toBe(0.125);
    expect(stopRopTableFactorPercent(1 / 8, 1)).toBe(13);
  });

  it('when 1.5 kg on 0.25 L/min, then the factor is 17 (16.67 before rounding)', () => {
    // §10 #14: STOP-ROP Table 1 [C]
    expect(100 * cannulaFactor(0.25, 1.5)).toBeCloseTo(16.67, 2);
    expect(stopRopTableFactorPercent(0.25, 1.5)).toBe(17);
  });

  it('when 3 L/min at 4 kg and 3.5 kg, and 0.75 L/min at 0.7 kg, then 75, 86 and capped 100', () => {
    // §10 #17 and #18: STOP-ROP Table 1 [C]
    expect(stopRopTableFactorPercent(3, 4)).toBe(75);
    expect(stopRopTableFactorPercent(3, 3.5)).toBe(86);
    expect(stopRopTableFactorPercent(0.75, 0.7)).toBe(100);
  });
});

// docs/clinical-sources.md §3.1 effective FiO2 check values [X] (model: 0.21 + factor × (source − 0.21)).
const EFFECTIVE_TABLE = [
  { weightKg: 1.5, flowLpm: 0.25, source: 1, factor: 16.67, fio2: 0.3417 },
  { weightKg: 1.0, flowLpm: 0.125, source: 1, factor: 12.5, fio2: 0.3088 },
  { weightKg: 2.0, flowLpm: 0.5, source: 1, factor: 25.0, fio2: 0.4075 },
  { weightKg: 3.0, flowLpm: 0.25, source: 1, factor: 8.33, fio2: 0.2758 },
  { weightKg: 3.0, flowLpm: 0.25, source: 0.5, factor: 8.33, fio2: 0.2342 },
  { weightKg: 2.5, flowLpm: 0.5, source: 0.6, factor: 20.0, fio2: 0.288 },
  { weightKg: 3.5, flowLpm: 0.125, source: 1, factor: 3.57, fio2: 0.2382 },
  { weightKg: 1.0, flowLpm: 1.5, source: 0.4, factor: 100, fio2: 0.4 },
];

describe('effective FiO2 on a low-flow cannula (Benaron–Benitz as tabulated by STOP-ROP)', () => {
  it.each(EFFECTIVE_TABLE)(
    'when $weightKg kg on $flowLpm L/min of source $source, then effective FiO2 is $fio2',
    ({ weightKg, flowLpm, source, factor, fio2 }) => {
      // docs/clinical-sources.md §3.1 effective FiO2 table [X], printed to 4 decimals (0.30875 is printed 0.3088, so
      // the tolerance is half a unit in the last place, inclusive)
      expect(100 * cannulaFactor(flowLpm, weightKg)).toBeCloseTo(factor, 2);
      expect(Math.abs(effectiveFio2(flowLpm, weightKg, source) - fio2)).toBeLessThanOrEqual(0.00005 + 1e-12);
    },
  );

  it('when 1.5 kg gets 0.25 L/min of 100%, then the printed worked example gives 34%', () => {
    // §10 #15: STOP-ROP worked example, factor 17 → effective FiO2 34% [C]; computed 34.17%
    expect(Math.round(100 * effectiveFio2(0.25, 1.5, 1))).toBe(34);
  });

  it('when flow is zero, then the infant breathes room air', () => {
    expect(effectiveFio2(0, 3, 1)).toBe(0.21);
  });

  it('when the inputs are out of range, then they are refused', () => {
    expect(() => cannulaFactor(0.5, 0)).toThrow(RangeError);
    expect(() => cannulaFactor(-0.1, 2)).toThrow(RangeError);
    expect(() => effectiveFio2(0.5, 2, 1.2)).toThrow(RangeError);
  });
});

describe('flow for a target effective FiO2 (inverse)', () => {
  it('when the target is above the source purity, then no flow can reach it', () => {
    expect(flowForEffectiveFio2(0.96, 3, 0.95)).toEqual({ feasible: false, flowLpm: null, factor: null });
  });

  it('when the target is room air or below, then no flow is needed', () => {
    expect(flowForEffectiveFio2(0.21, 3, 1)).toEqual({ feasible: true, flowLpm: 0, factor: 0 });
    expect(flowForEffectiveFio2(0.18, 3, 1).flowLpm).toBe(0);
  });

  it('when the target equals the source, then the flow equals the weight (the breath is just filled)', () => {
    // computed from factor = 1 ⇔ flow = weight (STOP-ROP: at LPM ≥ kg the infant inhales only cannula gas)
    expect(flowForEffectiveFio2(0.95, 2.5, 0.95).flowLpm).toBeCloseTo(2.5, 12);
  });

  it('when 3 kg needs 0.3486 on 100%, then the flow is 0.526 L/min', () => {
    // §2.4 worked example [X]: factor (0.3486 − 0.21)/0.79 = 0.1754, × 3 kg = 0.526 L/min
    expect(flowForEffectiveFio2(0.3486, 3, 1).flowLpm).toBeCloseTo(0.526, 3);
  });

  it('when an uncapped flow is converted to FiO2 and back, then the same flow returns', () => {
    // inverse ∘ forward = identity below the cap (computed from the model's algebra)
    fc.assert(
      fc.property(
        fc.double({ min: 0.3, max: 15, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0.22, max: 1, noNaN: true }),
        (weightKg, share, source) => {
          const flowLpm = share * weightKg;
          const back = flowForEffectiveFio2(effectiveFio2(flowLpm, weightKg, source), weightKg, source);
          expect(back.feasible).toBe(true);
          expect(back.flowLpm as number).toBeCloseTo(flowLpm, 9);
        },
      ),
    );
  });

  it('when a feasible flow is found, then forward ∘ inverse gives the target back', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.3, max: 15, noNaN: true }),
        fc.double({ min: 0.21, max: 1, noNaN: true }),
        fc.double({ min: 0.22, max: 1, noNaN: true }),
        (weightKg, target, source) => {
          fc.pre(target <= source);
          const inverse = flowForEffectiveFio2(target, weightKg, source);
          expect(effectiveFio2(inverse.flowLpm as number, weightKg, source)).toBeCloseTo(target, 12);
        },
      ),
    );
  });
});
