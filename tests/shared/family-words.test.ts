import { describe, expect, it } from 'vitest';
import { hoursText, journeyCautions, periodLines, spo2TargetText } from '@shared/family/care-text';
import { dateInWords, dateTimeInWords, timeInWords } from '@shared/dates/date-words';

describe('family words', () => {
  it('when hours are written, then one is singular, others plural, never "hour(s)"', () => {
    expect(hoursText(1)).toBe('1 hour');
    expect(hoursText(3)).toBe('3 hours');
    expect(hoursText(1.5)).toBe('1.5 hours');
    const cautions = journeyCautions({
      mode: 'road', cabinAltitudeFt: null, plannedForDestination: false, destinationLowerPressureThanHome: false,
      exceedsCannula: false, keptHomeFlow: false, hoursAway: 1, reservePercent: 20,
    });
    expect(cautions.join(' ')).toContain('Cylinder numbers cover 1 hour away from your home supply');
    expect(cautions.join(' ')).not.toContain('(s)');
  });

  it('when awake, asleep and feeding share a flow, then it is one line; when one differs, each part has its line', () => {
    const same = periodLines([{ period: 'awake', flowLpm: 0.25 }, { period: 'asleep', flowLpm: 0.25 }, { period: 'feeding', flowLpm: 0.25 }]);
    expect(same).toEqual([{ label: 'Awake, asleep and feeding', flowLpm: 0.25 }]);
    const differ = periodLines([{ period: 'awake', flowLpm: 0.25 }, { period: 'asleep', flowLpm: 0.5 }, { period: 'feeding', flowLpm: 0.25 }]);
    expect(differ.map((line) => line.label)).toEqual(['Awake', 'Asleep', 'Feeding']);
    expect(periodLines([{ period: 'awake', flowLpm: null }, { period: 'asleep', flowLpm: null }])).toEqual([{ label: 'Awake and asleep', flowLpm: null }]);
  });

  it('when the target is written, then it names the mean to reach and the reading counted as low', () => {
    // Programme defaults: overnight mean >= 93 % (TSANZ 2020; BTS 2009), spot <= 90 % low (ATS 2019).
    expect(spo2TargetText({ meanMin: 93, lowAtOrBelow: 90 })).toMatch(/^Oxygen saturation \(SpO2\) to aim for: 93% or more on average\. A steady reading of 90% or less is low: check the cannula/);
    // Off oxygen (the last step down) there is no cannula or supply to check first.
    expect(spo2TargetText({ meanMin: 93, lowAtOrBelow: 90 }, false)).toBe('Oxygen saturation (SpO2) to aim for: 93% or more on average. A steady reading of 90% or less is low: call your team.');
  });
});

describe('dates and times in words', () => {
  it('when a calendar date is written, then it is day, month in letters and year, whatever zone the reader is in', () => {
    expect(dateInWords('2026-12-03')).toBe('3 Dec 2026');
    expect(dateInWords('2026-01-31T23:30:00Z')).toBe('31 Jan 2026');
    expect(dateInWords('not a date')).toBe('not a date');
  });

  it('when a time is written, then it is on the 24-hour clock in the zone given', () => {
    const evening = new Date('2026-07-01T20:05:00Z');
    expect(timeInWords(evening, 'Europe/London')).toBe('21:05');
    expect(timeInWords(new Date('2026-07-01T00:07:00Z'), 'UTC')).toBe('00:07');
    expect(dateTimeInWords(evening, 'UTC')).toBe('1 Jul 2026, 20:05');
  });
});
