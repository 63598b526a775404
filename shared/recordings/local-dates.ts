/**
 * Dates and clock times as devices write them in their local time: `24/11/2026`, `11/24/2026`, `2026-11-24`,
 * `21:00:00`, `9:00 PM`. Reading the date needs its order; `settleDateOrder` finds it when the file's own dates
 * decide it (a 24 can only be a day) and says so when they cannot.
 */

export const DATE_ORDERS = ['dmy', 'mdy', 'ymd'] as const;
export type DateOrder = (typeof DATE_ORDERS)[number];
export const DATE_ORDER_WORDS: Record<DateOrder, string> = { dmy: 'day/month/year', mdy: 'month/day/year', ymd: 'year-month-day' };

/** The three numbers of a written date, in the order written. */
export interface DateParts {
  first: number;
  second: number;
  third: number;
  /** The first number has four digits: year-month-day whatever order was chosen. */
  yearFirst: boolean;
}

const DATE = /^(\d{1,4})([./-])(\d{1,2})\2(\d{1,4})$/;
const CLOCK = /^(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,3})\d*)?)?(?:\s*([AaPp])\.?[Mm]\.?)?$/;
const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const isLeap = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;

export function readDateParts(raw: string): DateParts | null {
  const m = DATE.exec(raw.trim());
  if (!m) return null;
  const yearFirst = m[1].length === 4;
  const lastLength = m[4].length;
  // A year is written with four digits, or two at the end (24/11/26).
  if (yearFirst ? lastLength > 2 : lastLength !== 4 && lastLength !== 2) return null;
  if (!yearFirst && m[1].length > 2) return null;
  return { first: Number(m[1]), second: Number(m[3]), third: Number(m[4]), yearFirst };
}

/** Year, month and day under an order, or null when that is no calendar date (month 13, 31 April). */
export function toCalendarDate(p: DateParts, order: DateOrder): { year: number; month: number; day: number } | null {
  const [yearText, month, day] = p.yearFirst ? [p.first, p.second, p.third]
    : order === 'dmy' ? [p.third, p.second, p.first]
      : order === 'mdy' ? [p.third, p.first, p.second] : [Number.NaN, 0, 0];
  const year = yearText < 100 ? 2000 + yearText : yearText;
  if (!(year >= 1900) || month < 1 || month > 12 || day < 1) return null;
  const days = month === 2 && isLeap(year) ? 29 : DAYS_IN_MONTH[month - 1];
  return day > days ? null : { year, month, day };
}

/** Milliseconds since midnight for a 24-hour or am/pm clock time, or null. */
export function readClockTime(raw: string): number | null {
  const m = CLOCK.exec(raw.trim());
  if (!m) return null;
  let hour = Number(m[1]);
  const minute = Number(m[2]);
  const second = m[3] === undefined ? 0 : Number(m[3]);
  const ms = m[4] === undefined ? 0 : Number(m[4].padEnd(3, '0'));
  if (m[5] !== undefined) {
    if (hour < 1 || hour > 12) return null;
    hour = (hour % 12) + (m[5].toLowerCase() === 'p' ? 12 : 0);
  }
  if (hour > 23 || minute > 59 || second > 59) return null;
  return ((hour * 60 + minute) * 60 + second) * 1000 + ms;
}

/** A date and a time in one cell: `24/11/2026 21:00:00` or `2026-11-24T21:00:00`. */
export function splitDateTime(raw: string): [string, string] | null {
  const m = /^([\d./-]+)(?:[Tt]|\s+)(\d.*)$/.exec(raw.trim());
  return m ? [m[1], m[2]] : null;
}

export type DateOrderOutcome = { ok: true; order: DateOrder } | { ok: false; index: number; message: string };

/**
 * The order of day and month, from every date of the file. A first number above 12 can only be a day, a second
 * above 12 only a day too (month first). Dates that read the same both ways (05/05) decide nothing. When nothing
 * decides, or the file holds both kinds, the person is asked.
 */
export function settleDateOrder(dates: readonly DateParts[], shown: (index: number) => string): DateOrderOutcome {
  let dayFirst = -1;
  let monthFirst = -1;
  let unclear = -1;
  dates.forEach((p, i) => {
    if (p.yearFirst) return;
    if (p.first > 12 && dayFirst < 0) dayFirst = i;
    else if (p.second > 12 && monthFirst < 0) monthFirst = i;
    else if (p.first !== p.second && unclear < 0) unclear = i;
  });
  if (dayFirst >= 0 && monthFirst >= 0) {
    const message = `${shown(dayFirst)} reads day first but ${shown(monthFirst)} reads month first. Choose the date order the oximeter uses and upload again.`;
    return { ok: false, index: Math.min(dayFirst, monthFirst), message };
  }
  if (dayFirst >= 0) return { ok: true, order: 'dmy' };
  if (monthFirst >= 0) return { ok: true, order: 'mdy' };
  if (unclear < 0) return { ok: true, order: 'dmy' };
  const message = `${shown(unclear)} could be day/month/year or month/day/year, and no date in the file settles it. Choose the date order and upload again.`;
  return { ok: false, index: unclear, message };
}
