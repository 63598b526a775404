import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  ISA_EXPONENT,
  geopotentialFromGeometricM,
  isaPressureMmHg,
  isaPressurePaAtGeopotentialM,
  resolvePressure,
  westPressureMmHg,
} from '@shared/clinical/pressure';
import { mmHgToPa, paToMmHg } from '@shared/clinical/units';

// docs/clinical-sources.md §1.2. tablePa: U.S. Standard Atmosphere 1976 tabulated pressures by geometric altitude
// [C a]; geometricMmHg and geopotentialPa: computed from the USSA-1976 troposphere formula [X]; westMmHg: computed
// from the West 1996 coefficients [X, coefficients C2].
const TABLE_1_2 = [
  { elevationM: 0, tablePa: 101325, geometricMmHg: 760.0, geopotentialPa: 101325, westMmHg: 759.5 },
  { elevationM: 500, tablePa: 95461, geometricMmHg: 716.02, geopotentialPa: 95461, westMmHg: 718.2 },
  { elevationM: 1000, tablePa: 89876, geometricMmHg: 674.13, geopotentialPa: 89875, westMmHg: 678.6 },
  { elevationM: 1500, tablePa: 84559, geometricMmHg: 634.25, geopotentialPa: 84556, westMmHg: 640.7 },
  { elevationM: 2000, tablePa: 79501, geometricMmHg: 596.31, geopotentialPa: 79495, westMmHg: 604.5 },
  { elevationM: 2438.4, tablePa: null, geometricMmHg: 564.58, geopotentialPa: 75262, westMmHg: 574.0 },
  { elevationM: 2500, tablePa: 74691, geometricMmHg: 560.23, geopotentialPa: 74683, westMmHg: 569.8 },
  { elevationM: 3000, tablePa: 70121, geometricMmHg: 525.95, geopotentialPa: 70109, westMmHg: 536.8 },
  { elevationM: 4000, tablePa: 61660, geometricMmHg: 462.49, geopotentialPa: 61640, westMmHg: 475.3 },
  { elevationM: 5000, tablePa: 54048, geometricMmHg: 405.4, geopotentialPa: 54020, westMmHg: 419.7 },
];

describe('ISA barometric pressure (U.S. Standard Atmosphere 1976)', () => {
  it('when the constants are combined, then the exponent g0·M0/(R*·L) is 5.255876', () => {
    // docs/clinical-sources.md §1.1 and §10 #7: computed from the USSA-1976 constants
    expect(ISA_EXPONENT).toBeCloseTo(5.255876, 6);
  });

  it.each(TABLE_1_2)('when the geometric elevation is $elevationM m, then PB matches the §1.2 table', (row) => {
    const pressureMmHg = isaPressureMmHg(row.elevationM);
    // §1.2 geometric mmHg column, computed from the ISA formula with H = r0·Z/(r0 + Z); tolerance ±0.05 mmHg
    expect(Math.abs(pressureMmHg - row.geometricMmHg)).toBeLessThanOrEqual(0.05);
    // §1.2 USSA-1976 table by geometric altitude [C a]; within 2 Pa (the table rounds to 5 digits)
    if (row.tablePa !== null) expect(Math.abs(mmHgToPa(pressureMmHg) - row.tablePa)).toBeLessThanOrEqual(2);
  });

  it.each(TABLE_1_2)('when $elevationM m is read as geopotential, then PB matches the geopotential column', (row) => {
    // §1.2 "P (H geopotential)" column, computed from the ISA troposphere formula; the table rounds to 1 Pa
    expect(Math.abs(isaPressurePaAtGeopotentialM(row.elevationM) - row.geopotentialPa)).toBeLessThanOrEqual(1);
  });

  it('when the ADC review table lists 1000–5000 m, then the rounded pressures agree', () => {
    // Arch Dis Child review Table 1 [C b]: 1000/2000/3000/5000 m → 674/596/526/405 mmHg and 90/80/70/54 kPa
    const adc = [
      [1000, 674, 90],
      [2000, 596, 80],
      [3000, 526, 70],
      [5000, 405, 54],
    ];
    for (const [elevationM, mmHg, kPa] of adc) {
      expect(Math.round(isaPressureMmHg(elevationM))).toBe(mmHg);
      expect(Math.round(mmHgToPa(isaPressureMmHg(elevationM)) / 1000)).toBe(kPa);
    }
  });

  it('when the cabin is at 8000 ft, then PB is 564.58 mmHg geometric and about 560 mmHg', () => {
    // §1.2: 564.58 mmHg geometric, 564.51 geopotential [X]; ADC 2008;93:528 "about 560 mmHg" for 8000 ft [C c]
    const cabin = resolvePressure({ elevationFt: 8000 });
    expect(cabin.pressureMmHg).toBeCloseTo(564.58, 2);
    expect(paToMmHg(isaPressurePaAtGeopotentialM(2438.4))).toBeCloseTo(564.51, 2);
    expect(Math.abs(cabin.pressureMmHg - 560)).toBeLessThan(5);
  });

  it('when elevation is geometric, then geopotential height is slightly lower', () => {
    // computed from H = r0·Z/(r0 + Z) with r0 = 6356766 m (USSA-1976): 1000 m → 999.84 m
    expect(geopotentialFromGeometricM(1000)).toBeCloseTo(999.8427, 3);
    expect(geopotentialFromGeometricM(0)).toBe(0);
  });

  it('when the elevation is beyond the troposphere or absurdly low, then it is refused', () => {
    // the troposphere formula holds to 11 km geopotential (USSA-1976 tropopause, §1.1)
    expect(() => isaPressureMmHg(11_100)).toThrow(RangeError);
    expect(() => isaPressureMmHg(-2500)).toThrow(RangeError);
    expect(() => isaPressureMmHg(Number.NaN)).toThrow(RangeError);
  });

  it('when elevation rises, then ISA and West pressures both fall', () => {
    // physical property of any model atmosphere; checked across the accepted −500..6000 m input range
    fc.assert(
      fc.property(
        // a rise of at least 1 cm, so the two heights are genuinely different rather than float neighbours
        fc.double({ min: -500, max: 5990, noNaN: true }),
        fc.double({ min: 0.01, max: 10, noNaN: true }),
        (lowM, riseM) => {
          const highM = lowM + riseM;
          expect(isaPressureMmHg(highM)).toBeLessThan(isaPressureMmHg(lowM));
          expect(westPressureMmHg(highM)).toBeLessThan(westPressureMmHg(lowM));
        },
      ),
    );
  });
});

describe('West 1996 model atmosphere', () => {
  it.each(TABLE_1_2)('when the elevation is $elevationM m, then PB is $westMmHg mmHg', (row) => {
    // §1.2 and §1.3 West column: computed from exp(6.63268 − 0.1112 h − 0.00149 h²) [coefficients C2, West 1996]
    expect(Math.abs(westPressureMmHg(row.elevationM) - row.westMmHg)).toBeLessThanOrEqual(0.05);
  });

  it('when on the Everest summit (8.848 km), then West gives 252.7 Torr where ISA gives 235.8', () => {
    // §1.3 and §10 #8: West 252.7 Torr [X]; ISA 235.8 Torr read as geopotential [X];
    // 253 Torr measured on the summit in 1981 [from memory]
    expect(westPressureMmHg(8848)).toBeCloseTo(252.7, 1);
    expect(paToMmHg(isaPressurePaAtGeopotentialM(8848))).toBeCloseTo(235.8, 1);
  });

  it('when at 2–3 km, then West is 8–11 mmHg above ISA', () => {
    // §1.3 "at 2–3 km the West model is 8–11 mmHg higher than ISA" [X]
    for (const elevationM of [2000, 2500, 3000]) {
      const difference = westPressureMmHg(elevationM) - isaPressureMmHg(elevationM);
      expect(difference).toBeGreaterThanOrEqual(8);
      expect(difference).toBeLessThanOrEqual(11);
    }
  });
});

describe('resolvePressure', () => {
  it('when given feet, then the result equals the same height in metres', () => {
    // 1 ft = 0.3048 m exactly; 5000 ft = 1524 m
    expect(resolvePressure({ elevationFt: 5000 }).pressureMmHg).toBeCloseTo(isaPressureMmHg(1524), 10);
    expect(resolvePressure({ elevationFt: 5000 }).elevationM).toBeCloseTo(1524, 10);
  });

  it('when a measured pressure is given, then it overrides any model and is named "measured"', () => {
    const resolved = resolvePressure({ pressureMmHg: 640.2 }, 'west-1996');
    expect(resolved).toEqual({ pressureMmHg: 640.2, model: 'measured', elevationM: null, geopotentialM: null });
  });

  it('when the West model is asked for, then it is used and named', () => {
    const resolved = resolvePressure({ elevationM: 3000 }, 'west-1996');
    expect(resolved.model).toBe('west-1996');
    expect(resolved.pressureMmHg).toBeCloseTo(536.8, 1); // §1.3 West check value at 3 km [X]
    expect(resolved.geopotentialM).toBeNull();
  });

  it('when no model is given, then ISA is the default and reports its geopotential height', () => {
    const resolved = resolvePressure({ elevationM: 1000 });
    expect(resolved.model).toBe('isa-1976');
    expect(resolved.geopotentialM).toBeCloseTo(999.8427, 3);
  });

  it('when a measured pressure is zero or negative, then it is refused', () => {
    expect(() => resolvePressure({ pressureMmHg: 0 })).toThrow(RangeError);
  });
});
