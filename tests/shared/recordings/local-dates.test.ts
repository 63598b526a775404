import { describe, expect, it } from 'vitest';
import { DATE_ORDER_WORDS, DATE_ORDERS, readClockTime, readDateParts, settleDateOrder, splitDateTime, toCalendarDate } from '@shared/recordings/local-dates';

const shown = (i: number) => `row ${i}`;
const dates = (...written: string[]) => written.map((w) => readDateParts(w)!);

describe('local dates and clock times as devices write them', () => {
  it('when the orders are listed, then they are the three the upload form offers, with their words', () => {
    expect(DATE_ORDERS).toEqual(['dmy', 'mdy', 'ymd']);
    expect(DATE_ORDER_WORDS).toEqual({ dmy: 'day/month/year', mdy: 'month/day/year', ymd: 'year-month-day' });
  });

  it('when a date is written with /, . or -, then its three numbers are kept in the written order', () => {
    expect(readDateParts(' 24/11/2026 ')).toEqual({ first: 24, second: 11, third: 2026, yearFirst: false });
    expect(readDateParts('1.2.26')).toEqual({ first: 1, second: 2, third: 26, yearFirst: false });
    expect(readDateParts('2026-11-24')).toEqual({ first: 2026, second: 11, third: 24, yearFirst: true });
  });

  it('when a date mixes separators or has a wrong number of digits, then it is not a date', () => {
    for (const bad of ['24/11-2026', '24/11/202', '2026-11-241', '123/11/2026', '24/11', 'tomorrow', '24/111/2026']) expect(readDateParts(bad)).toBeNull();
  });

  it('when an order is applied, then day and month come from their places; a two-digit year is 20xx', () => {
    const p = readDateParts('03/04/26')!;
    expect(toCalendarDate(p, 'dmy')).toEqual({ year: 2026, month: 4, day: 3 });
    expect(toCalendarDate(p, 'mdy')).toEqual({ year: 2026, month: 3, day: 4 });
    expect(toCalendarDate(p, 'ymd')).toBeNull();
    expect(toCalendarDate(readDateParts('2026-04-03')!, 'mdy')).toEqual({ year: 2026, month: 4, day: 3 });
  });

  it('when the date is not on the calendar, then it is refused at the boundary (Gregorian calendar rules)', () => {
    const on = (w: string) => toCalendarDate(readDateParts(w)!, 'dmy');
    expect(on('29/02/2028')).toEqual({ year: 2028, month: 2, day: 29 });
    expect(on('29/02/2026')).toBeNull();
    expect(on('29/02/2100')).toBeNull();
    expect(on('29/02/2000')).toEqual({ year: 2000, month: 2, day: 29 });
    expect(on('30/04/2026')).toEqual({ year: 2026, month: 4, day: 30 });
    expect(on('31/04/2026')).toBeNull();
    expect(on('31/12/2026')).toEqual({ year: 2026, month: 12, day: 31 });
    expect(on('01/13/2026')).toBeNull();
    expect(on('00/12/2026')).toBeNull();
    expect(on('01/00/2026')).toBeNull();
    expect(on('01/01/1899')).toBeNull();
    expect(on('01/01/1900')).toEqual({ year: 1900, month: 1, day: 1 });
  });

  it('when a clock time is written with or without seconds, fraction or am/pm, then it reads as milliseconds after midnight', () => {
    expect(readClockTime('21:00:00')).toBe(75_600_000);
    expect(readClockTime(' 9:05 ')).toBe(32_700_000);
    expect(readClockTime('23:59:59.5')).toBe(86_399_500);
    expect(readClockTime('00:00:01,25')).toBe(1_250);
    expect(readClockTime('00:00:00.1234')).toBe(123);
    expect(readClockTime('9:00:00 PM')).toBe(75_600_000);
    expect(readClockTime('12:30 am')).toBe(1_800_000);
    expect(readClockTime('12:30 p.m.')).toBe(45_000_000);
    expect(readClockTime('1:00 AM')).toBe(3_600_000);
  });

  it('when a clock time is out of range, then it is not a time', () => {
    for (const bad of ['24:00:00', '23:60', '23:59:60', '13:00 pm', '0:30 am', '21', '21:0', 'noon']) expect(readClockTime(bad)).toBeNull();
    expect(readClockTime('23:59:59')).toBe(86_399_000);
    expect(readClockTime('12:59 pm')).toBe(46_740_000);
  });

  it('when one cell holds both, then date and time are split at T or spaces', () => {
    expect(splitDateTime('24/11/2026 21:00:00')).toEqual(['24/11/2026', '21:00:00']);
    expect(splitDateTime('2026-11-24T21:00')).toEqual(['2026-11-24', '21:00']);
    expect(splitDateTime('2026-11-24  9:00 PM')).toEqual(['2026-11-24', '9:00 PM']);
    expect(splitDateTime('21:00:00')).toBeNull();
    expect(splitDateTime('24/11/2026')).toBeNull();
  });
});

describe('settling the order of day and month from the file', () => {
  it('when a first number is above 12, then the file is day first; a second above 12, month first', () => {
    expect(settleDateOrder(dates('05/11/2026', '24/11/2026'), shown)).toEqual({ ok: true, order: 'dmy' });
    expect(settleDateOrder(dates('11/05/2026', '11/24/2026'), shown)).toEqual({ ok: true, order: 'mdy' });
    expect(settleDateOrder(dates('12/12/2026', '12/13/2026'), shown)).toEqual({ ok: true, order: 'mdy' });
  });

  it('when every date reads the same both ways, or all are year first, then nothing needs asking', () => {
    expect(settleDateOrder(dates('05/05/2026', '05/05/2026'), shown)).toEqual({ ok: true, order: 'dmy' });
    expect(settleDateOrder(dates('2026-03-04'), shown)).toEqual({ ok: true, order: 'dmy' });
    expect(settleDateOrder([], shown)).toEqual({ ok: true, order: 'dmy' });
  });

  it('when no date settles it, then the first unclear date is named and the order asked for', () => {
    expect(settleDateOrder(dates('05/05/2026', '03/04/2026', '04/04/2026'), shown)).toEqual({
      ok: false, index: 1,
      message: 'row 1 could be day/month/year or month/day/year, and no date in the file settles it. Choose the date order and upload again.',
    });
  });

  it('when the file holds both kinds, then both are named and the order asked for', () => {
    expect(settleDateOrder(dates('03/04/2026', '13/04/2026', '04/14/2026'), shown)).toEqual({
      ok: false, index: 1,
      message: 'row 1 reads day first but row 2 reads month first. Choose the date order the oximeter uses and upload again.',
    });
    expect(settleDateOrder(dates('04/14/2026', '13/04/2026'), shown)).toMatchObject({ ok: false, index: 0 });
  });
});
