import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  feetToMetres,
  hoursOneDecimal,
  hPaToMmHg,
  kPaToMmHg,
  metresToFeet,
  mmHgToHPa,
  mmHgToKPa,
  mmHgToPa,
  mmHgToPsi,
  paToMmHg,
} from '@shared/clinical/units';

describe('pressure and length units', () => {
  it('when converting 1 mmHg, then it is 133.3224 Pa and 1 kPa is 7.50062 mmHg', () => {
    // docs/clinical-sources.md header: 1 mmHg = 101325/760 Pa = 133.3224 Pa;
    // 1 kPa = 7.50062 mmHg (computed from 760/101.325)
    expect(mmHgToPa(1)).toBeCloseTo(133.3224, 4);
    expect(kPaToMmHg(1)).toBeCloseTo(7.50062, 5);
  });

  it('when converting standard sea-level pressure, then 760 mmHg is 101.325 kPa and 1013.25 hPa', () => {
    // USSA-1976 P0 = 101325 Pa = 1013.25 hPa = 760 mmHg (docs/clinical-sources.md §1.1)
    expect(mmHgToKPa(760)).toBeCloseTo(101.325, 10);
    expect(mmHgToHPa(760)).toBeCloseTo(1013.25, 10);
    expect(hPaToMmHg(1013.25)).toBeCloseTo(760, 10);
    expect(paToMmHg(101325)).toBe(760);
  });

  it('when converting 8000 ft, then it is exactly 2438.4 m', () => {
    // 1 ft = 0.3048 m exactly (international foot), so 8000 ft = 2438.4 m (docs/clinical-sources.md header)
    expect(feetToMetres(8000)).toBeCloseTo(2438.4, 10);
    expect(metresToFeet(2438.4)).toBeCloseTo(8000, 9);
  });

  it('when converting 8000 ft cabin pressure to psi, then it is 10.92 psi', () => {
    // docs/clinical-sources.md §1.2 "Psi at 8000 ft: 10.92 psi", computed from 75262 Pa ÷ 6894.757 Pa/psi
    expect(mmHgToPsi(564.51)).toBeCloseTo(10.92, 2);
  });

  it('when a pressure goes to kPa, hPa or Pa and back, then it is unchanged', () => {
    // computed from the unit definitions: each pair is an exact inverse
    fc.assert(
      fc.property(fc.double({ min: 1, max: 2000, noNaN: true }), (pressureMmHg) => {
        expect(kPaToMmHg(mmHgToKPa(pressureMmHg))).toBeCloseTo(pressureMmHg, 9);
        expect(hPaToMmHg(mmHgToHPa(pressureMmHg))).toBeCloseTo(pressureMmHg, 9);
        expect(paToMmHg(mmHgToPa(pressureMmHg))).toBeCloseTo(pressureMmHg, 9);
      }),
    );
  });
});

describe('hours for sentences', () => {
  it('when minutes are written as hours, then they keep one decimal, rounding halves up', () => {
    // 300 min is the 5 h minimum valid time (Urschitz 2003, docs/clinical-sources.md §5.1)
    expect(hoursOneDecimal(300)).toBe(5);
    expect(hoursOneDecimal(60)).toBe(1);
    expect(hoursOneDecimal(534)).toBe(8.9);
    expect(hoursOneDecimal(531)).toBe(8.9);
    expect(hoursOneDecimal(530)).toBe(8.8);
  });
});

