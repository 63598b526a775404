import { describe, expect, it } from 'vitest';
import { cylinderTime, fullCylinderMinutes, hoursAndMinutesText, type CylinderSpec } from '@shared/clinical/cylinder-time';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';

// The Virginia "Oxygen Cylinder Guidance" sheet gives factors of 0.28 L/psi (E) and 0.16 L/psi (D) with a 200 psi
// safe residual (docs/clinical-sources.md §7 [C]). A programme lists contents and full pressure, so each factor is
// written as contents ÷ full pressure: 616 L ÷ 2200 psi = 0.28 and 352 L ÷ 2200 psi = 0.16.
const E: CylinderSpec = { contentLitres: 616, fullPressure: 2200, residualPressure: 200 };
const D: CylinderSpec = { contentLitres: 352, fullPressure: 2200, residualPressure: 200 };

describe('cylinder time', () => {
  it('when an E cylinder reads 2000 psi at 2 L/min, then it lasts 252 minutes', () => {
    // docs/clinical-sources.md §7 and §10 #23: (2000 − 200) × 0.28 ÷ 2 = 252 min [C factor, X arithmetic]
    const t = cylinderTime({ cylinder: E, gauge: 2000, flowLpm: 2, reservePercent: 0 });
    expect(t.factor).toBeCloseTo(0.28, 12);
    expect(t.minutesTotal).toBeCloseTo(252, 9);
    expect(t.minutesBeforeReserve).toBeCloseTo(252, 9);
    expect(t.reserveMinutes).toBeCloseTo(0, 9);
  });

  it('when a D cylinder reads 2000 psi at 0.5 L/min, then it lasts 576 minutes', () => {
    // §7 check value [X]: (2000 − 200) × 0.16 ÷ 0.5
    expect(cylinderTime({ cylinder: D, gauge: 2000, flowLpm: 0.5, reservePercent: 0 }).minutesTotal).toBeCloseTo(576, 9);
  });

  it('when a full E cylinder (2200 psi) runs at 0.25 L/min with no residual, then it lasts 2464 minutes (41.1 h)', () => {
    // §7 check value [X]: 2200 × 0.28 ÷ 0.25
    const t = cylinderTime({ cylinder: { ...E, residualPressure: 0 }, gauge: 2200, flowLpm: 0.25, reservePercent: 0 });
    expect(t.minutesTotal).toBeCloseTo(2464, 9);
    expect((t.minutesTotal as number) / 60).toBeCloseTo(41.1, 1);
    expect(t.fractionLeft).toBe(1);
  });

  it('when the programme keeps a 50% reserve, then two thirds of the time is usable before the reserve', () => {
    // Reserve as in the journey rule, need × (1 + 0.5): 252 ÷ 1.5 = 168 min before the reserve, 84 min kept (computed)
    const t = cylinderTime({ cylinder: E, gauge: 2000, flowLpm: 2, reservePercent: 50 });
    expect(t.minutesBeforeReserve).toBeCloseTo(168, 9);
    expect(t.reserveMinutes).toBeCloseTo(84, 9);
  });

  it('when the cylinder is metric (bar), then the same factor method applies', () => {
    // Demo "small portable" cylinder, 460 L at 230 bar, residual 20 bar: (200 − 20) × 2 L/bar ÷ 0.5 = 720 min (computed)
    const small = DEFAULT_POLICY_SETTINGS.supply.cylinders.find((c) => c.id === 'small-portable')!;
    const t = cylinderTime({ cylinder: small, gauge: 200, flowLpm: 0.5, reservePercent: 0 });
    expect(t.usableLitres).toBeCloseTo(360, 9);
    expect(t.minutesTotal).toBeCloseTo(720, 9);
    expect(fullCylinderMinutes(small, 0.5)).toBeCloseTo(840, 9);
  });

  it('when the gauge is at or below the change-over pressure, then no time is left, never a negative time', () => {
    const t = cylinderTime({ cylinder: E, gauge: 150, flowLpm: 1, reservePercent: 50 });
    expect(t.minutesTotal).toBe(0);
    expect(t.minutesBeforeReserve).toBe(0);
    expect(t.fractionLeft).toBe(0);
  });

  it('when the flow is 0 (oxygen off), then there is no duration, not Infinity', () => {
    const t = cylinderTime({ cylinder: E, gauge: 2000, flowLpm: 0, reservePercent: 50 });
    expect(t.minutesTotal).toBeNull();
    expect(t.minutesBeforeReserve).toBeNull();
  });

  it('when the gauge reads above full, then it is flagged; at or below full it is not', () => {
    // A reading above the rated full pressure means a warm cylinder or a gauge fault (common practice); a
    // flag on every ordinary reading would teach families to ignore it.
    expect(cylinderTime({ cylinder: E, gauge: 2300, flowLpm: 1, reservePercent: 0 }).gaugeAboveFull).toBe(true);
    expect(cylinderTime({ cylinder: E, gauge: 2200, flowLpm: 1, reservePercent: 0 }).gaugeAboveFull).toBe(false);
    expect(cylinderTime({ cylinder: E, gauge: 1000, flowLpm: 1, reservePercent: 0 }).gaugeAboveFull).toBe(false);
  });

  it('when the gauge is below the change-over pressure, then no usable gas is left, never a negative amount', () => {
    // Factor method (docs/clinical-sources.md §7 [C]): usable = (gauge − residual) × factor, floored at 0.
    const t = cylinderTime({ cylinder: E, gauge: 150, flowLpm: 1, reservePercent: 0 });
    expect(t.usableLitres).toBe(0);
    expect(t.reserveMinutes).toBe(0);
  });

  it('when half the usable pressure is left, then half the cylinder is left', () => {
    // (1200 − 200) ÷ (2200 − 200) = 0.5 of the usable range (computed, §7 factor method).
    const t = cylinderTime({ cylinder: E, gauge: 1200, flowLpm: 1, reservePercent: 0 });
    expect(t.fractionLeft).toBeCloseTo(0.5, 12);
    expect(t.usableLitres).toBeCloseTo(280, 9);
  });

  it('when the flow is 0, then no reserve time is shown either', () => {
    expect(cylinderTime({ cylinder: E, gauge: 2000, flowLpm: 0, reservePercent: 50 }).reserveMinutes).toBeNull();
  });

  it('when inputs are impossible, then they are refused', () => {
    expect(() => cylinderTime({ cylinder: E, gauge: -1, flowLpm: 1, reservePercent: 0 })).toThrow(RangeError);
    expect(() => cylinderTime({ cylinder: E, gauge: 1000, flowLpm: -1, reservePercent: 0 })).toThrow(RangeError);
    expect(() => cylinderTime({ cylinder: E, gauge: 1000, flowLpm: 1, reservePercent: -5 })).toThrow(RangeError);
    expect(() => cylinderTime({ cylinder: E, gauge: 1000, flowLpm: 1, reservePercent: Number.NaN })).toThrow(RangeError);
    expect(() => cylinderTime({ cylinder: { ...E, contentLitres: 0 }, gauge: 1000, flowLpm: 1, reservePercent: 0 })).toThrow(/positive contents and full pressure/);
    expect(() => cylinderTime({ cylinder: { ...E, fullPressure: 0 }, gauge: 0, flowLpm: 1, reservePercent: 0 })).toThrow(/positive contents and full pressure/);
    expect(() => cylinderTime({ cylinder: E, gauge: 1000, flowLpm: 1, reservePercent: 0 })).not.toThrow();
  });

  it('when minutes are shown to a family, then they are rounded down, never up', () => {
    expect(hoursAndMinutesText(252)).toBe('4 h 12 min');
    expect(hoursAndMinutesText(167.99)).toBe('2 h 47 min');
    expect(hoursAndMinutesText(120)).toBe('2 h');
    expect(hoursAndMinutesText(45.5)).toBe('45 min');
    expect(hoursAndMinutesText(59.999)).toBe('59 min');
    expect(hoursAndMinutesText(60)).toBe('1 h');
    expect(hoursAndMinutesText(-3)).toBe('0 min');
  });
});
