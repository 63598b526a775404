import { describe, expect, it } from 'vitest';
import { agesAt, formatCorrectedAge, splitWeeksDays } from '@shared/clinical/ages';
import { cannulaFactor, effectiveFio2, flowForEffectiveFio2 } from '@shared/clinical/cannula';
import { cylinderMinutesFromBar, cylinderMinutesFromPsi, cylinderRemainingFraction, cylindersForJourney } from '@shared/clinical/cylinders';
import { parseIsoDate } from '@shared/clinical/dates';
import { assertValidSteps, roundUpToStepLpm } from '@shared/clinical/flowmeter';
import { equivalentFio2, inspiredPo2MmHg } from '@shared/clinical/oxygen';
import { isaPressureMmHg, isaPressurePaAtGeopotentialM, resolvePressure } from '@shared/clinical/pressure';
import { WorkingSheet } from '@shared/clinical/working';

// Product rule: bad input gets a clear error naming what is wrong, never a plausible-looking number. Each refusal
// below is checked at its boundary (the last accepted value beside the first refused one) and by its message.

describe('refusals name the value that is wrong', () => {
  it('when a gestation is outside 18–45 weeks or 0–6 days, then it is refused; the limits themselves are accepted', () => {
    // A typing guard, not a clinical limit: live births outside 18–45 weeks are not plausible entries (from memory).
    const at = (weeks: number, days: number) => () => agesAt({ birthDate: '2026-01-01', gestationAtBirth: { weeks, days }, atDate: '2026-02-01' });
    expect(at(18, 0)).not.toThrow();
    expect(at(45, 6)).not.toThrow();
    expect(at(17, 6)).toThrow('Gestation weeks must be 18–45');
    expect(at(46, 0)).toThrow('Gestation weeks must be 18–45');
    expect(at(30.5, 0)).toThrow('Gestation weeks must be 18–45');
    expect(at(30, 7)).toThrow('Gestation days must be 0–6');
    expect(at(30, -1)).toThrow('Gestation days must be 0–6');
    expect(at(30, 1.5)).toThrow('Gestation days must be 0–6');
  });

  it('when the date is the birth date, then ages are 0; a day earlier is refused', () => {
    const born = agesAt({ birthDate: '2026-01-01', gestationAtBirth: { weeks: 40, days: 0 }, atDate: '2026-01-01' });
    expect(born.chronological).toMatchObject({ totalDays: 0, weeks: 0, days: 0, completedMonths: 0 });
    // AAP 2004 [C]: at term (40+0) there is nothing to correct, so corrected age is 0 and counts months from birth.
    expect(born.corrected).toMatchObject({ totalDays: 0, completedMonths: 0 });
    expect(formatCorrectedAge(born.corrected)).toBe('0 d');
    expect(() => agesAt({ birthDate: '2026-01-01', gestationAtBirth: { weeks: 40, days: 0 }, atDate: '2025-12-31' })).toThrow('The date is before birth');
  });

  it('when weeks and days are split, then both carry the sign of the total and zero has no sign', () => {
    // −15 d is −2 wk −1 d (AAP 2004 style, same sign), and 0 d is 0 wk 0 d, never −0.
    expect(splitWeeksDays(-15)).toEqual({ weeks: -2, days: -1 });
    expect(splitWeeksDays(15)).toEqual({ weeks: 2, days: 1 });
    expect(Object.is(splitWeeksDays(0).weeks, 0) && Object.is(splitWeeksDays(0).days, 0)).toBe(true);
    expect(splitWeeksDays(-7)).toEqual({ weeks: -1, days: 0 });
  });

  it('when corrected age is under a week, two years exactly, or years and months, then it reads in those units', () => {
    // Weeks and days under 3 months, months to 2 years, years and months after (common practice in follow-up).
    const corrected = (totalDays: number, completedMonths: number | null) => formatCorrectedAge({ totalDays, completedMonths, weeks: 0, days: 0, termEquivalentDate: '2026-01-01' });
    expect(corrected(5, 0)).toBe('5 d');
    expect(corrected(-5, null)).toBe('5 d before term');
    expect(corrected(700, 23)).toBe('23 mo');
    expect(corrected(731, 24)).toBe('2 y');
    expect(corrected(1100, 36)).toBe('3 y');
    expect(corrected(800, 26)).toBe('2 y 2 mo');
    expect(corrected(14, 0)).toBe('2 wk');
  });

  it('when a calendar date is malformed or does not exist, then the message quotes it', () => {
    expect(() => parseIsoDate('2026-1-01')).toThrow('Date 2026-1-01 is not in YYYY-MM-DD form');
    expect(() => parseIsoDate('2026-02-30')).toThrow('Date 2026-02-30 does not exist');
    expect(() => parseIsoDate('2026-13-01')).toThrow('Date 2026-13-01 does not exist');
    expect(() => parseIsoDate('2026-04-31')).toThrow('Date 2026-04-31 does not exist');
    expect(() => parseIsoDate('2026-01-32')).toThrow('does not exist');
    expect(() => parseIsoDate('2026-00-10')).toThrow('Date 2026-00-10 does not exist');
    expect(() => parseIsoDate('0099-01-01')).toThrow('Date 0099-01-01 does not exist');
    expect(parseIsoDate('2024-02-29')).toEqual({ year: 2024, month: 2, day: 29 });
    expect(parseIsoDate('2026-12-31')).toEqual({ year: 2026, month: 12, day: 31 });
  });

  it('when a cannula input is impossible, then the message names it and its value', () => {
    expect(() => cannulaFactor(0.5, 0)).toThrow('Weight 0 kg must be positive');
    expect(() => cannulaFactor(-0.1, 3)).toThrow('Flow -0.1 L/min must be 0 or more');
    expect(() => cannulaFactor(Number.NaN, 3)).toThrow(RangeError);
    expect(() => effectiveFio2(0.5, 3, 0.2)).toThrow('Source oxygen fraction 0.2 must lie between 0.21 and 1');
    expect(() => effectiveFio2(0.5, 3, 1.01)).toThrow('Source oxygen fraction 1.01 must lie between 0.21 and 1');
    expect(() => effectiveFio2(0.5, 3, Number.NaN)).toThrow(RangeError);
    expect(effectiveFio2(0.5, 3, 0.21)).toBeCloseTo(0.21, 12);
    expect(effectiveFio2(0.5, 3, 1)).toBeCloseTo(0.21 + (0.5 / 3) * 0.79, 12);
    expect(() => flowForEffectiveFio2(0.5, 3, 1.2)).toThrow('Source oxygen fraction 1.2');
    expect(() => flowForEffectiveFio2(Number.NaN, 3, 1)).toThrow('Target FiO2 NaN is not a number');
  });

  it('when a target is one float step above the source after a pressure ratio of 1, then it is still reachable', () => {
    // Float noise, not an unreachable target (cannula.ts tolerance); a real excess is refused.
    expect(flowForEffectiveFio2(1 + 1e-13, 3, 1)).toEqual({ feasible: true, flowLpm: 3, factor: 1 });
    expect(flowForEffectiveFio2(1.0001, 3, 1).feasible).toBe(false);
  });

  it('when a cylinder input is impossible, then the message names the input', () => {
    const psi = { gaugePsi: 2000, cylinderFactorLPerPsi: 0.28, flowLpm: 1 };
    expect(() => cylinderMinutesFromPsi({ ...psi, flowLpm: -1 })).toThrow('Flow must be 0 or more');
    expect(() => cylinderMinutesFromPsi({ ...psi, gaugePsi: -1 })).toThrow('Gauge pressure must be 0 or more');
    expect(() => cylinderMinutesFromPsi({ ...psi, cylinderFactorLPerPsi: -0.1 })).toThrow('Cylinder factor must be 0 or more');
    expect(() => cylinderMinutesFromPsi({ ...psi, residualPsi: -1 })).toThrow('Residual pressure must be 0 or more');
    expect(() => cylinderMinutesFromPsi({ ...psi, gaugePsi: Number.POSITIVE_INFINITY })).toThrow(RangeError);
    const bar = { waterCapacityL: 2, gaugeBar: 200, flowLpm: 0.5, residualBar: 0 };
    expect(() => cylinderMinutesFromBar({ ...bar, waterCapacityL: -2 })).toThrow('Water capacity must be 0 or more');
    expect(() => cylinderMinutesFromBar({ ...bar, gaugeBar: -1 })).toThrow('Gauge pressure must be 0 or more');
    expect(() => cylinderMinutesFromBar({ ...bar, residualBar: -1 })).toThrow('Residual pressure must be 0 or more');
    expect(() => cylinderMinutesFromBar({ ...bar, compressibilityMultiplier: 0 })).toThrow('Compressibility multiplier must be positive');
    expect(cylinderMinutesFromBar({ ...bar, compressibilityMultiplier: 0.5 })).toBe(400);
    expect(() => cylinderRemainingFraction(200, 200, 200)).toThrow('Full pressure must be above the residual');
    expect(cylinderRemainingFraction(200, 201, 200)).toBe(0);
    const trip = { journeyHours: 2, minutesPerCylinder: 60, reserveFraction: 0.5 };
    expect(() => cylindersForJourney({ ...trip, journeyHours: -1 })).toThrow('Journey length must be 0 or more');
    expect(() => cylindersForJourney({ ...trip, reserveFraction: -0.1 })).toThrow('Reserve must be 0 or more');
    expect(() => cylindersForJourney({ ...trip, minutesPerCylinder: 0 })).toThrow('A cylinder must last more than 0 minutes');
    expect(cylindersForJourney({ ...trip, minutesPerCylinder: 0.5 })).toBe(360);
  });

  it('when flowmeter steps are unusable, then the message says which rule they break', () => {
    expect(() => assertValidSteps([])).toThrow('At least one flowmeter step is needed');
    expect(() => assertValidSteps([0.1, 0])).toThrow('Step 0 L/min must be positive');
    expect(() => assertValidSteps([0.1, 0.1])).toThrow('Flowmeter steps must be ascending');
    expect(() => assertValidSteps([0.2, 0.1])).toThrow('Flowmeter steps must be ascending');
    expect(() => assertValidSteps([0.1])).not.toThrow();
    expect(() => roundUpToStepLpm(-0.1, [0.1])).toThrow('Required flow -0.1 L/min must be 0 or more');
  });

  it('when a requirement sits exactly on a step, then that step is chosen, not the next', () => {
    // Never round down, and never round up past an exact match (docs/clinical-sources.md; programme steps).
    expect(roundUpToStepLpm(0.25, [0.1, 0.25, 0.5])).toBe(0.25);
  });

  it('when a working line is added twice, then the sheet refuses, so no step is shown twice with two values', () => {
    const sheet = new WorkingSheet();
    const line = { key: 'a', label: 'A', value: 1, unit: 'kg' as const, formula: 'f', source: 's' };
    expect(sheet.add(line)).toBe(1);
    expect(sheet.add({ ...line, key: 'b', value: 2 })).toBe(2);
    expect(() => sheet.add({ ...line, value: 3 })).toThrow('Working line a added twice');
    expect(sheet.toArray().map((l) => l.key)).toEqual(['a', 'b']);
  });

  it('when an elevation is below −2 km or above the ISA troposphere, then it is refused; the limits themselves are not', () => {
    // ISA 1976 troposphere up to 11 km geopotential (docs/clinical-sources.md §1.1 [C]); −2 km is below any inhabited land
    // (the Dead Sea shore is near −430 m, from memory).
    expect(isaPressureMmHg(-2000)).toBeGreaterThan(760);
    expect(() => isaPressureMmHg(-2000.1)).toThrow('Elevation -2000.1 m is outside the supported range');
    expect(isaPressurePaAtGeopotentialM(11000)).toBeCloseTo(22632.1, 0); // USSA 1976 tropopause 22632.1 Pa (docs/clinical-sources.md §1.1 [C])
    expect(() => isaPressurePaAtGeopotentialM(11000.1)).toThrow('Geopotential height 11000.1 m is outside the ISA troposphere');
    expect(() => resolvePressure({ pressureMmHg: 0 })).toThrow('Pressure 0 mmHg is not a usable measurement');
    expect(() => resolvePressure({ pressureMmHg: Number.NaN })).toThrow(RangeError);
  });

  it('when the pressure leaves no dry gas above the water vapour, or a dry-form destination is not positive, then it is refused', () => {
    expect(() => inspiredPo2MmHg(0.21, 47)).toThrow('Pressure 47 mmHg leaves no dry gas above 47 mmHg of water');
    expect(inspiredPo2MmHg(0.21, 48)).toBeCloseTo(0.21, 12);
    expect(() => equivalentFio2(0.21, 760, 0, 'dry')).toThrow('Destination pressure must be positive');
    expect(equivalentFio2(0.21, 760, 380, 'dry')).toBeCloseTo(0.42, 12);
  });
});

