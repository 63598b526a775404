import { describe, expect, it } from 'vitest';
import { agesAt, formatCorrectedAge, formatWeeksPlusDays } from '@shared/clinical/ages';
import { completedMonthsBetween, daysBetween } from '@shared/clinical/dates';

describe('ages (AAP 2004 terminology)', () => {
  it('when born at 28+0 wk and 10 wk old, then PMA is 38+0 wk and corrected age is −2 wk', () => {
    // docs/clinical-sources.md §8.1 and §10 #24 [X from AAP 2004 definitions, Engle, Pediatrics 2004;114:1362]
    // 2024-01-01 + 70 days = 2024-03-11 (2024 is a leap year)
    const ages = agesAt({ birthDate: '2024-01-01', gestationAtBirth: { weeks: 28, days: 0 }, atDate: '2024-03-11' });
    expect(ages.chronological).toMatchObject({ totalDays: 70, weeks: 10, days: 0 });
    expect(ages.postmenstrual).toMatchObject({ weeks: 38, days: 0 });
    expect(ages.corrected).toMatchObject({ totalDays: -14, weeks: -2, days: 0, completedMonths: null });
    expect(formatCorrectedAge(ages.corrected)).toBe('2 wk before term');
  });

  it('when born at 26+0 wk and 20 wk old, then PMA is 46 wk and corrected age is 6 wk', () => {
    // §8.1 [X]; 2024-01-01 + 140 days = 2024-05-20
    const ages = agesAt({ birthDate: '2024-01-01', gestationAtBirth: { weeks: 26, days: 0 }, atDate: '2024-05-20' });
    expect(ages.postmenstrual).toMatchObject({ weeks: 46, days: 0 });
    expect(ages.corrected).toMatchObject({ totalDays: 42, weeks: 6, days: 0 });
    expect(formatCorrectedAge(ages.corrected)).toBe('6 wk');
  });

  it('when born at 25+5 wk and 12 d old, then GA is 25 completed weeks and PMA 27+3 wk', () => {
    // §8.1 [X]; AAP 2004: gestational age in completed weeks, 25+5 is "25 weeks", never rounded up [C]
    const ages = agesAt({ birthDate: '2024-01-01', gestationAtBirth: { weeks: 25, days: 5 }, atDate: '2024-01-13' });
    expect(ages.gestationAtBirth.completedWeeks).toBe(25);
    expect(formatWeeksPlusDays(ages.gestationAtBirth)).toBe('25+5 wk');
    expect(formatWeeksPlusDays(ages.postmenstrual)).toBe('27+3 wk');
  });

  it('when corrected age is 6 wk 2 d, then it reads "6 wk 2 d"', () => {
    const ages = agesAt({ birthDate: '2024-01-01', gestationAtBirth: { weeks: 26, days: 0 }, atDate: '2024-05-22' });
    expect(formatCorrectedAge(ages.corrected)).toBe('6 wk 2 d');
  });

  it('when three calendar months have passed since the term-equivalent date, then it reads "3 mo"', () => {
    // born 2024-01-01 at 26+0: 98 days short of 40 wk, term-equivalent 2024-04-08
    const ages = agesAt({ birthDate: '2024-01-01', gestationAtBirth: { weeks: 26, days: 0 }, atDate: '2024-07-08' });
    expect(ages.corrected.termEquivalentDate).toBe('2024-04-08');
    expect(ages.corrected.completedMonths).toBe(3);
    expect(formatCorrectedAge(ages.corrected)).toBe('3 mo');
    const gestationAtBirth = { weeks: 26, days: 0 };
    const dayBefore = agesAt({ birthDate: '2024-01-01', gestationAtBirth, atDate: '2024-07-07' });
    expect(formatCorrectedAge(dayBefore.corrected)).toBe('12 wk 6 d');
  });

  it('when corrected age passes two years, then it reads in years and months', () => {
    const ages = agesAt({ birthDate: '2022-01-01', gestationAtBirth: { weeks: 40, days: 0 }, atDate: '2024-07-15' });
    expect(formatCorrectedAge(ages.corrected)).toBe('2 y 6 mo');
  });

  it('when born at or after 40 weeks, then corrected age equals chronological age', () => {
    // AAP 2004: corrected age subtracts only the weeks born before 40 weeks
    const ages = agesAt({ birthDate: '2024-03-01', gestationAtBirth: { weeks: 41, days: 2 }, atDate: '2024-04-01' });
    expect(ages.corrected.totalDays).toBe(ages.chronological.totalDays);
    expect(ages.chronological.completedMonths).toBe(1);
  });

  it('when a month-end birthday meets a short month, then the month completes on its last day', () => {
    expect(completedMonthsBetween('2024-01-31', '2024-02-29')).toBe(1);
    expect(completedMonthsBetween('2024-01-31', '2024-02-28')).toBe(0);
    expect(completedMonthsBetween('2023-03-15', '2024-03-14')).toBe(11);
  });

  it('when dates span a daylight-saving change, then whole days are still counted', () => {
    // dates are whole UTC days; Europe changes clocks on the last Sunday of March
    expect(daysBetween('2024-03-30', '2024-04-01')).toBe(2);
  });

  it('when a date is malformed, impossible, or before birth, then it is refused', () => {
    const gestationAtBirth = { weeks: 30, days: 0 };
    expect(() => agesAt({ birthDate: '2024-02-30', gestationAtBirth, atDate: '2024-05-01' })).toThrow(RangeError);
    expect(() => agesAt({ birthDate: '2024-2-3', gestationAtBirth, atDate: '2024-05-01' })).toThrow(RangeError);
    expect(() => agesAt({ birthDate: '2024-05-01', gestationAtBirth, atDate: '2024-04-30' })).toThrow(RangeError);
    const badDays = { weeks: 30, days: 7 };
    const badInput = { birthDate: '2024-05-01', gestationAtBirth: badDays, atDate: '2024-05-02' };
    expect(() => agesAt(badInput)).toThrow(RangeError);
  });
});
