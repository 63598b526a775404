import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import {
  changeNoteAt, inQuietHours, instantAtOrAfter, journeyReminderAt, outsideQuietHours, planVisitReminders, type ReminderRules,
} from '@shared/reminders/timing';

// Time-zone facts below are IANA tz database rules (2026):
// - Europe/London: GMT (UTC+0) in winter, BST (UTC+1) in summer; forward 01:00 UTC on 29 March, back 01:00 UTC on 25 October.
// - America/Denver: MST (UTC−7) / MDT (UTC−6); forward 02:00 local on 8 March, back 02:00 local on 1 November.
// - Pacific/Auckland: NZST (UTC+12) / NZDT (UTC+13); back 03:00 NZDT on 5 April, forward 02:00 NZST on 27 September.
// Policy defaults: quiet hours 21:00–08:00 (product rule); day-before 17:00 and morning 08:00 (common practice).
const RULES: ReminderRules = DEFAULT_POLICY_SETTINGS.reminders;
const iso = (d: Date) => d.toISOString();
const at = (s: string) => new Date(s);
const plan = (date: string, time: string, timeZone: string, startsAt: string, now: string, rules: ReminderRules = RULES) =>
  planVisitReminders({ date, time, timeZone, startsAt: at(startsAt) }, rules, at(now)).map((p) => ({ template: p.template, sendAt: iso(p.sendAt), notAfter: iso(p.notAfter), skip: p.skip }));

describe('policy defaults for reminder times', () => {
  it('when no programme setting is given, then quiet hours are 21:00–08:00 (product rule), day-before 17:00 and morning 08:00 (common practice)', () => {
    expect(RULES).toMatchObject({ quietStart: '21:00', quietEnd: '08:00', dayBeforeAt: '17:00', morningOfAt: '08:00' });
  });
});

describe('quiet hours (default 21:00–08:00, London in winter = UTC)', () => {
  const LON = 'Europe/London';
  it('when a message is due at 20:59, then it goes at 20:59', () => {
    expect(inQuietHours(at('2026-12-03T20:59:00Z'), LON, RULES)).toBe(false);
    expect(iso(outsideQuietHours(at('2026-12-03T20:59:00Z'), LON, RULES))).toBe('2026-12-03T20:59:00.000Z');
  });

  it('when a message is due at 21:00, then it is held to 08:00 the next day', () => {
    expect(inQuietHours(at('2026-12-03T21:00:00Z'), LON, RULES)).toBe(true);
    expect(iso(outsideQuietHours(at('2026-12-03T21:00:00Z'), LON, RULES))).toBe('2026-12-04T08:00:00.000Z');
  });

  it('when a message is due at 23:59, then it is held to 08:00 the next day', () => {
    expect(iso(outsideQuietHours(at('2026-12-03T23:59:00Z'), LON, RULES))).toBe('2026-12-04T08:00:00.000Z');
  });

  it('when a message is due at 07:59, then it is held to 08:00 the same day; at 08:00 it goes', () => {
    expect(iso(outsideQuietHours(at('2026-12-03T07:59:00Z'), LON, RULES))).toBe('2026-12-03T08:00:00.000Z');
    expect(inQuietHours(at('2026-12-03T08:00:00Z'), LON, RULES)).toBe(false);
    expect(iso(outsideQuietHours(at('2026-12-03T08:00:00Z'), LON, RULES))).toBe('2026-12-03T08:00:00.000Z');
  });

  it('when start and end are equal, then there are no quiet hours', () => {
    const none = { quietStart: '00:00', quietEnd: '00:00' };
    expect(inQuietHours(at('2026-12-03T03:00:00Z'), LON, none)).toBe(false);
    expect(iso(outsideQuietHours(at('2026-12-03T03:00:00Z'), LON, none))).toBe('2026-12-03T03:00:00.000Z');
    expect(inQuietHours(at('2026-12-03T00:00:00Z'), LON, { quietStart: '21:00', quietEnd: '21:00' })).toBe(false);
  });

  it('when the window does not cross midnight (12:00–14:00), then only the middle of the day is held, to 14:00 the same day', () => {
    const lunch = { quietStart: '12:00', quietEnd: '14:00' };
    expect(inQuietHours(at('2026-12-03T11:59:00Z'), LON, lunch)).toBe(false);
    expect(iso(outsideQuietHours(at('2026-12-03T12:00:00Z'), LON, lunch))).toBe('2026-12-03T14:00:00.000Z');
    expect(iso(outsideQuietHours(at('2026-12-03T13:59:00Z'), LON, lunch))).toBe('2026-12-03T14:00:00.000Z');
    expect(inQuietHours(at('2026-12-03T14:00:00Z'), LON, lunch)).toBe(false);
    expect(inQuietHours(at('2026-12-03T22:00:00Z'), LON, lunch)).toBe(false);
  });

  it("when it is summer in London, then quiet hours follow the family's clock (21:00 BST = 20:00 UTC)", () => {
    expect(inQuietHours(at('2026-07-03T19:59:00Z'), LON, RULES)).toBe(false);
    expect(iso(outsideQuietHours(at('2026-07-03T20:00:00Z'), LON, RULES))).toBe('2026-07-04T07:00:00.000Z');
  });

  it('when a message is held over the spring-forward night, then it goes at 08:00 BST (07:00 UTC)', () => {
    expect(iso(outsideQuietHours(at('2026-03-28T21:30:00Z'), LON, RULES))).toBe('2026-03-29T07:00:00.000Z');
  });

  it('when a message is held over the fall-back night, then it goes at 08:00 GMT (08:00 UTC)', () => {
    // 21:30 BST on the 24th.
    expect(iso(outsideQuietHours(at('2026-10-24T20:30:00Z'), LON, RULES))).toBe('2026-10-25T08:00:00.000Z');
  });

  it('when quiet hours end inside the hour skipped by the clock change, then the message goes at the first minute that exists', () => {
    // 00:15 GMT on 29 March, quiet until 01:30 which does not exist that night: 02:00 BST = 01:00 UTC.
    expect(iso(outsideQuietHours(at('2026-03-29T00:15:00Z'), LON, { quietStart: '00:00', quietEnd: '01:30' }))).toBe('2026-03-29T01:00:00.000Z');
    // Auckland skips 02:00–02:59 NZST on 27 September: 01:00 NZST (13:00 UTC on the 26th) held to 03:00 NZDT = 14:00 UTC.
    expect(iso(outsideQuietHours(at('2026-09-26T13:00:00Z'), 'Pacific/Auckland', { quietStart: '00:00', quietEnd: '02:30' }))).toBe('2026-09-26T14:00:00.000Z');
  });
});

describe('quiet hours ending inside the hour repeated as clocks go back', () => {
  const toHalfPastOne = { quietStart: '00:00', quietEnd: '01:30' };
  it('when the message is due in the first pass of the hour, then it goes at the first 01:30 (summer time)', () => {
    // 01:10 BST = 00:10 UTC.
    expect(iso(outsideQuietHours(at('2026-10-25T00:10:00Z'), 'Europe/London', toHalfPastOne))).toBe('2026-10-25T00:30:00.000Z');
  });

  it('when the message is due in the second pass, then it goes at the second 01:30, never before it was due', () => {
    // 01:10 GMT = 01:10 UTC; the first 01:30 (00:30 UTC) is already 40 minutes gone.
    expect(iso(outsideQuietHours(at('2026-10-25T01:10:00Z'), 'Europe/London', toHalfPastOne))).toBe('2026-10-25T01:30:00.000Z');
    // Denver: 01:10 MST = 08:10 UTC → 01:30 MST = 08:30 UTC.
    expect(iso(outsideQuietHours(at('2026-11-01T08:10:00Z'), 'America/Denver', toHalfPastOne))).toBe('2026-11-01T08:30:00.000Z');
  });
});

describe('local wall-clock times across clock changes', () => {
  it('when the time was skipped as clocks went forward, then the first minute that exists is used', () => {
    expect(iso(instantAtOrAfter('2026-03-29', '01:30', 'Europe/London'))).toBe('2026-03-29T01:00:00.000Z');
    expect(iso(instantAtOrAfter('2026-03-08', '02:15', 'America/Denver'))).toBe('2026-03-08T09:00:00.000Z');
  });

  it('when the time is repeated as clocks go back, then the earlier one (still summer time) is used', () => {
    expect(iso(instantAtOrAfter('2026-10-25', '01:30', 'Europe/London'))).toBe('2026-10-25T00:30:00.000Z');
  });
});

describe("the family's two visit reminders", () => {
  it('when the visit is on the spring-forward Sunday in London, then the day before is 17:00 GMT and the morning 08:00 BST', () => {
    expect(plan('2026-03-29', '10:00', 'Europe/London', '2026-03-29T09:00:00Z', '2026-03-25T12:00:00Z')).toEqual([
      { template: 'visit-day-before', sendAt: '2026-03-28T17:00:00.000Z', notAfter: '2026-03-29T08:45:00.000Z', skip: null },
      { template: 'visit-morning', sendAt: '2026-03-29T07:00:00.000Z', notAfter: '2026-03-29T08:45:00.000Z', skip: null },
    ]);
  });

  it('when the visit is on the fall-back Sunday in London, then the day before is 17:00 BST and the morning 08:00 GMT', () => {
    expect(plan('2026-10-25', '10:00', 'Europe/London', '2026-10-25T10:00:00Z', '2026-10-20T12:00:00Z')).toEqual([
      { template: 'visit-day-before', sendAt: '2026-10-24T16:00:00.000Z', notAfter: '2026-10-25T09:45:00.000Z', skip: null },
      { template: 'visit-morning', sendAt: '2026-10-25T08:00:00.000Z', notAfter: '2026-10-25T09:45:00.000Z', skip: null },
    ]);
  });

  it('when the visit is in Denver on the day clocks go forward, then the day before is 17:00 MST and the morning 08:00 MDT', () => {
    expect(plan('2026-03-08', '10:00', 'America/Denver', '2026-03-08T16:00:00Z', '2026-03-01T12:00:00Z')).toEqual([
      { template: 'visit-day-before', sendAt: '2026-03-08T00:00:00.000Z', notAfter: '2026-03-08T15:45:00.000Z', skip: null },
      { template: 'visit-morning', sendAt: '2026-03-08T14:00:00.000Z', notAfter: '2026-03-08T15:45:00.000Z', skip: null },
    ]);
  });

  it('when the visit is in Denver on the day clocks go back, then the day before is 17:00 MDT and the morning 08:00 MST', () => {
    expect(plan('2026-11-01', '10:00', 'America/Denver', '2026-11-01T17:00:00Z', '2026-10-28T12:00:00Z').map((p) => p.sendAt)).toEqual([
      '2026-10-31T23:00:00.000Z', '2026-11-01T15:00:00.000Z',
    ]);
  });

  it('when the family lives in Auckland and clocks go forward (southern spring, September), then NZST the day before and NZDT on the day', () => {
    expect(plan('2026-09-27', '10:00', 'Pacific/Auckland', '2026-09-26T21:00:00Z', '2026-09-20T00:00:00Z')).toEqual([
      { template: 'visit-day-before', sendAt: '2026-09-26T05:00:00.000Z', notAfter: '2026-09-26T20:45:00.000Z', skip: null },
      { template: 'visit-morning', sendAt: '2026-09-26T19:00:00.000Z', notAfter: '2026-09-26T20:45:00.000Z', skip: null },
    ]);
  });

  it('when the family lives in Auckland and clocks go back (southern autumn, April), then NZDT the day before and NZST on the day', () => {
    expect(plan('2026-04-05', '10:00', 'Pacific/Auckland', '2026-04-04T22:00:00Z', '2026-04-01T00:00:00Z').map((p) => p.sendAt)).toEqual([
      '2026-04-04T04:00:00.000Z', '2026-04-04T20:00:00.000Z',
    ]);
  });

  it("when the family is in Denver and the programme in London, then the family's clock decides, and London's night does not hold them", () => {
    // 17:00 MST on 2 December is 00:00 UTC on the 3rd: inside London's quiet hours, outside Denver's.
    expect(plan('2026-12-03', '10:00', 'America/Denver', '2026-12-03T17:00:00Z', '2026-11-30T12:00:00Z')).toEqual([
      { template: 'visit-day-before', sendAt: '2026-12-03T00:00:00.000Z', notAfter: '2026-12-03T16:45:00.000Z', skip: null },
      { template: 'visit-morning', sendAt: '2026-12-03T15:00:00.000Z', notAfter: '2026-12-03T16:45:00.000Z', skip: null },
    ]);
  });

  it('when the morning time falls in quiet hours and the visit starts before they end, then the morning reminder is kept as skipped for quiet hours', () => {
    const early = { ...RULES, morningOfAt: '07:00' };
    // Visit 07:40: the 07:00 reminder would be held to 08:00, after the last useful moment (07:25).
    expect(plan('2026-12-03', '07:40', 'Europe/London', '2026-12-03T07:40:00Z', '2026-11-30T12:00:00Z', early)).toEqual([
      { template: 'visit-day-before', sendAt: '2026-12-02T17:00:00.000Z', notAfter: '2026-12-03T07:25:00.000Z', skip: null },
      { template: 'visit-morning', sendAt: '2026-12-03T08:00:00.000Z', notAfter: '2026-12-03T07:25:00.000Z', skip: 'quiet-hours' },
    ]);
  });

  it('when the morning time is after the visit itself (07:00 visit, 08:00 reminder), then only the day-before reminder is planned', () => {
    expect(plan('2026-12-03', '07:00', 'Europe/London', '2026-12-03T07:00:00Z', '2026-11-30T12:00:00Z').map((p) => p.template)).toEqual(['visit-day-before']);
  });

  it('when the day-before time passed more than 10 minutes ago, then it is not planned; within 10 minutes it still is', () => {
    const visit = ['2026-12-03', '10:00', 'Europe/London', '2026-12-03T10:00:00Z'] as const;
    expect(plan(...visit, '2026-12-02T17:11:00Z').map((p) => p.template)).toEqual(['visit-morning']);
    expect(plan(...visit, '2026-12-02T17:09:00Z')).toEqual([
      { template: 'visit-day-before', sendAt: '2026-12-02T17:00:00.000Z', notAfter: '2026-12-03T09:45:00.000Z', skip: null },
      { template: 'visit-morning', sendAt: '2026-12-03T08:00:00.000Z', notAfter: '2026-12-03T09:45:00.000Z', skip: null },
    ]);
    expect(plan(...visit, '2026-12-03T08:30:00Z')).toEqual([]);
  });
});

describe('change notes and journeys', () => {
  it('when a visit changes late at night, then the note waits for 08:00; in the afternoon it goes at once', () => {
    expect(iso(changeNoteAt(at('2026-12-03T22:30:00Z'), 'Europe/London', RULES))).toBe('2026-12-04T08:00:00.000Z');
    // The same instant is 15:30 MST in Denver.
    expect(iso(changeNoteAt(at('2026-12-03T22:30:00Z'), 'America/Denver', RULES))).toBe('2026-12-03T22:30:00.000Z');
  });

  it("when a journey departs, then the reminder goes at 17:00 the day before on the family's clock", () => {
    expect(iso(journeyReminderAt('2026-03-29', 'Europe/London', RULES))).toBe('2026-03-28T17:00:00.000Z');
    expect(iso(journeyReminderAt('2026-03-30', 'Europe/London', RULES))).toBe('2026-03-29T16:00:00.000Z');
    expect(iso(journeyReminderAt('2026-10-26', 'Europe/London', RULES))).toBe('2026-10-25T17:00:00.000Z');
    expect(iso(journeyReminderAt('2026-09-28', 'Pacific/Auckland', RULES))).toBe('2026-09-27T04:00:00.000Z');
  });

  it('when the day-before time is inside quiet hours, then the journey reminder is held to 08:00 on the day of departure', () => {
    expect(iso(journeyReminderAt('2026-12-03', 'Europe/London', { ...RULES, dayBeforeAt: '22:00' }))).toBe('2026-12-03T08:00:00.000Z');
  });
});

describe('reminder times at their exact limits', () => {
  const visit = ['2026-12-03', '10:00', 'Europe/London', '2026-12-03T10:00:00Z'] as const;

  it('when the day-before time passed exactly 10 minutes ago, then it still goes', () => {
    // LATE_GRACE_MINUTES: a booking made a few minutes late still gets its reminder (common practice).
    expect(plan(...visit, '2026-12-02T17:10:00Z').map((p) => p.template)).toEqual(['visit-day-before', 'visit-morning']);
  });

  it('when a reminder would go exactly 15 minutes before the visit, then it is still useful and goes', () => {
    // LAST_USEFUL_MINUTES_BEFORE_VISIT = 15: a visit at 08:15 and the 08:00 morning reminder (common practice).
    const p = plan('2026-12-03', '08:15', 'Europe/London', '2026-12-03T08:15:00Z', '2026-11-30T12:00:00Z');
    expect(p.find((r) => r.template === 'visit-morning')).toEqual({ template: 'visit-morning', sendAt: '2026-12-03T08:00:00.000Z', notAfter: '2026-12-03T08:00:00.000Z', skip: null });
  });

  it('when the wanted time is exactly the last useful moment but quiet hours hold it past, then it is logged as skipped', () => {
    // Morning reminder wanted at 07:45 inside quiet hours (to 08:00), visit at 08:00: last useful moment 07:45.
    const early = { ...RULES, morningOfAt: '07:45' };
    const p = plan('2026-12-03', '08:00', 'Europe/London', '2026-12-03T08:00:00Z', '2026-11-30T12:00:00Z', early);
    expect(p.find((r) => r.template === 'visit-morning')).toEqual({ template: 'visit-morning', sendAt: '2026-12-03T08:00:00.000Z', notAfter: '2026-12-03T07:45:00.000Z', skip: 'quiet-hours' });
  });

  it('when a whole local day was skipped (Samoa, 30 December 2011), then no time on it is invented', () => {
    // Samoa skipped 30 December 2011 moving across the date line (IANA tz database): every minute tried fails.
    expect(() => instantAtOrAfter('2011-12-30', '17:00', 'Pacific/Apia')).toThrow('No valid local time after 2011-12-30 17:00 in Pacific/Apia');
  });

  it('when quiet hours cross midnight, then the first minute after them is free and the last minute before is held', () => {
    expect(inQuietHours(at('2026-12-03T08:00:00Z'), 'Europe/London', RULES)).toBe(false);
    expect(inQuietHours(at('2026-12-03T07:59:00Z'), 'Europe/London', RULES)).toBe(true);
    expect(inQuietHours(at('2026-12-03T20:59:00Z'), 'Europe/London', RULES)).toBe(false);
    expect(inQuietHours(at('2026-12-03T21:00:00Z'), 'Europe/London', RULES)).toBe(true);
  });
});

