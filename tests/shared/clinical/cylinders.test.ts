import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  US_CYLINDER_FACTORS_L_PER_PSI,
  cylinderMinutesFromBar,
  cylinderMinutesFromPsi,
  cylinderRemainingFraction,
  cylindersForJourney,
} from '@shared/clinical/cylinders';

const { D, E } = US_CYLINDER_FACTORS_L_PER_PSI;

describe('cylinder duration (psi gauges)', () => {
  it('when an E cylinder reads 2000 psi at 2 L/min, then it lasts 252 minutes', () => {
    // docs/clinical-sources.md §7 and §10 #23: (2000 − 200) × 0.28 / 2 = 252 min; factor 0.28 and 200 psi residual
    // from the Virginia "Oxygen Cylinder Guidance" sheet [C]
    expect(E).toBe(0.28);
    expect(cylinderMinutesFromPsi({ gaugePsi: 2000, cylinderFactorLPerPsi: E, flowLpm: 2 })).toBeCloseTo(252, 10);
  });

  it('when a D cylinder reads 2000 psi at 0.5 L/min, then it lasts 576 minutes', () => {
    // §7 check value [X]: (2000 − 200) × 0.16 / 0.5
    expect(cylinderMinutesFromPsi({ gaugePsi: 2000, cylinderFactorLPerPsi: D, flowLpm: 0.5 })).toBeCloseTo(576, 10);
  });

  it('when a full E cylinder (2200 psi) runs at 0.25 L/min with no residual, then it lasts 2464 min (41.1 h)', () => {
    // §7 check value [X]
    const minutes = cylinderMinutesFromPsi({ gaugePsi: 2200, cylinderFactorLPerPsi: E, flowLpm: 0.25, residualPsi: 0 });
    expect(minutes).toBeCloseTo(2464, 9);
    expect((minutes as number) / 60).toBeCloseTo(41.1, 1);
  });

  it('when portable units must give 10 L/min for 15 min, then D at 1150 psi and E at 750 psi just qualify', () => {
    // §7 minimum-content example [C Virginia sheet]: D ≥ 1150 psi, E ≥ 750 psi
    const d1150 = cylinderMinutesFromPsi({ gaugePsi: 1150, cylinderFactorLPerPsi: D, flowLpm: 10 });
    expect(d1150).toBeGreaterThanOrEqual(15);
    expect(cylinderMinutesFromPsi({ gaugePsi: 1100, cylinderFactorLPerPsi: D, flowLpm: 10 })).toBeLessThan(15);
    expect(cylinderMinutesFromPsi({ gaugePsi: 750, cylinderFactorLPerPsi: E, flowLpm: 10 })).toBeGreaterThanOrEqual(15);
  });

  it('when the flow is 0, then there is no duration (null), not Infinity', () => {
    expect(cylinderMinutesFromPsi({ gaugePsi: 2000, cylinderFactorLPerPsi: E, flowLpm: 0 })).toBeNull();
  });

  it('when the gauge is at or below the residual, then 0 minutes remain, never a negative time', () => {
    expect(cylinderMinutesFromPsi({ gaugePsi: 150, cylinderFactorLPerPsi: E, flowLpm: 1 })).toBe(0);
  });

  it('when inputs are negative, then they are refused', () => {
    expect(() => cylinderMinutesFromPsi({ gaugePsi: 2000, cylinderFactorLPerPsi: E, flowLpm: -1 })).toThrow(RangeError);
  });
});

describe('cylinder duration (metric)', () => {
  it('when a 2 L water cylinder at 200 bar runs at 0.5 L/min as an ideal gas, then it lasts 800 minutes', () => {
    // §7 check value [X]: 2 × 200 / 0.5
    expect(cylinderMinutesFromBar({ waterCapacityL: 2, gaugeBar: 200, flowLpm: 0.5, residualBar: 0 })).toBe(800);
  });

  it('when a 50 L cylinder at 200 bar is corrected by 1.07, then it holds about 10.7 m³', () => {
    // §7 [C Greek medical-gas supplier]: 50 L × 200 bar ≈ 10 m³ ideal, × 1.07 ≈ 10.7 m³
    // (at 1 L/min, minutes equal litres)
    const minutes = cylinderMinutesFromBar({
      waterCapacityL: 50,
      gaugeBar: 200,
      flowLpm: 1,
      residualBar: 0,
      compressibilityMultiplier: 1.07,
    });
    expect(minutes).toBeCloseTo(10700, 6);
  });

  it('when a residual is kept, then only the pressure above it counts', () => {
    // computed: 2 L × (200 − 20) bar / 0.5 L/min = 720 min
    expect(cylinderMinutesFromBar({ waterCapacityL: 2, gaugeBar: 200, flowLpm: 0.5, residualBar: 20 })).toBe(720);
    expect(cylinderMinutesFromBar({ waterCapacityL: 2, gaugeBar: 200, flowLpm: 0, residualBar: 20 })).toBeNull();
  });
});

describe('reserve and journey supply', () => {
  it('when an E cylinder reads 1200 of 2200 psi, then half its usable gas is left', () => {
    // computed: (1200 − 200) / (2200 − 200)
    expect(cylinderRemainingFraction(1200, 2200)).toBeCloseTo(0.5, 12);
    expect(cylinderRemainingFraction(100, 2200)).toBe(0);
  });

  it('when a 10 h journey with 10% reserve needs exactly 3 cylinders of 220 min, then 3 are asked for, not 4', () => {
    // 600 × 1.1 / 220 = 3 in exact arithmetic; float gives 3.0000000000000004
    expect(cylindersForJourney({ journeyHours: 10, minutesPerCylinder: 220, reserveFraction: 0.1 })).toBe(3);
  });

  it('when there is no journey, then no cylinder is needed; any journey needs at least one', () => {
    expect(cylindersForJourney({ journeyHours: 0, minutesPerCylinder: 220, reserveFraction: 0.5 })).toBe(0);
    expect(cylindersForJourney({ journeyHours: 1e-9, minutesPerCylinder: 5000, reserveFraction: 0 })).toBe(1);
  });

  it('when a journey needs part of a cylinder more, then it rounds up', () => {
    // a full E at 0.5 L/min, no residual: 2200 × 0.28 / 0.5 = 1232 min; 30 h × 1.5 = 2700 min → 2.19 → 3
    expect(cylindersForJourney({ journeyHours: 30, minutesPerCylinder: 1232, reserveFraction: 0.5 })).toBe(3);
  });

  it('when any journey is planned, then the cylinders cover the need with its reserve', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 72, noNaN: true }),
        fc.double({ min: 10, max: 5000, noNaN: true }),
        fc.double({ min: 0, max: 2, noNaN: true }),
        (journeyHours, minutesPerCylinder, reserveFraction) => {
          const count = cylindersForJourney({ journeyHours, minutesPerCylinder, reserveFraction });
          const neededMinutes = journeyHours * 60 * (1 + reserveFraction);
          // the float tolerance may only absorb a billionth of a cylinder
          expect(count * minutesPerCylinder).toBeGreaterThanOrEqual(neededMinutes - 1e-9 * minutesPerCylinder);
          expect((count - 1) * minutesPerCylinder).toBeLessThan(neededMinutes);
          if (neededMinutes > 0) expect(count).toBeGreaterThanOrEqual(1);
        },
      ),
    );
  });
});
