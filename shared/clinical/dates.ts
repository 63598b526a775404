const MS_PER_DAY = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

export interface CalendarDate {
  year: number;
  month: number;
  day: number;
}

/**
 * Dates arrive as plain 'YYYY-MM-DD' strings and are counted as whole UTC days, so no clock, time zone or
 * daylight-saving change can shift an age by a day. 2024-02-30 and the like are refused, not rolled over.
 */
export function parseIsoDate(isoDate: string): CalendarDate {
  const match = ISO_DATE.exec(isoDate);
  if (!match) throw new RangeError(`Date ${isoDate} is not in YYYY-MM-DD form`);
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const check = new Date(Date.UTC(year, month - 1, day));
  // An impossible month or day rolls over into another day of the month or another year; Date.UTC also reads the
  // years 0–99 as 1900–1999, which the year comparison refuses.
  if (check.getUTCFullYear() !== year || check.getUTCDate() !== day) {
    throw new RangeError(`Date ${isoDate} does not exist`);
  }
  return { year, month, day };
}

export function dayNumber(isoDate: string): number {
  const { year, month, day } = parseIsoDate(isoDate);
  return Date.UTC(year, month - 1, day) / MS_PER_DAY;
}

export function daysBetween(fromIsoDate: string, toIsoDate: string): number {
  return dayNumber(toIsoDate) - dayNumber(fromIsoDate);
}

export function addDays(isoDate: string, days: number): string {
  const shifted = new Date((dayNumber(isoDate) + days) * MS_PER_DAY);
  return shifted.toISOString().slice(0, 10);
}

/**
 * Completed calendar months, the way a birthday counts: a month is complete on the same day-of-month. From the
 * 31st, a shorter month completes on its last day (31 Jan → 28/29 Feb counts as one month).
 */
export function completedMonthsBetween(fromIsoDate: string, toIsoDate: string): number {
  const from = parseIsoDate(fromIsoDate);
  const to = parseIsoDate(toIsoDate);
  let months = (to.year - from.year) * 12 + (to.month - from.month);
  const lastDayOfToMonth = new Date(Date.UTC(to.year, to.month, 0)).getUTCDate();
  const anniversaryDay = Math.min(from.day, lastDayOfToMonth);
  if (to.day < anniversaryDay) months -= 1;
  return months;
}
