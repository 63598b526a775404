/**
 * One way of writing dates and times everywhere people read them (web pages, the printed plan): the day, the month
 * in letters and the year ("3 Dec 2026"), and a 24-hour clock ("21:05"). A month in letters cannot be read as the
 * day the other way round, and a 24-hour time needs no "am"/"pm". Pure: the zone is an argument, never the machine's.
 */
const LOCALE = 'en-GB';
const calendar = new Intl.DateTimeFormat(LOCALE, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
const byZone = new Map<string, { date: Intl.DateTimeFormat; time: Intl.DateTimeFormat }>();

function formattersFor(timeZone: string | undefined) {
  const key = timeZone ?? '';
  let found = byZone.get(key);
  if (!found) {
    found = {
      date: new Intl.DateTimeFormat(LOCALE, { day: 'numeric', month: 'short', year: 'numeric', timeZone }),
      time: new Intl.DateTimeFormat(LOCALE, { hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZone }),
    };
    byZone.set(key, found);
  }
  return found;
}

/** A calendar date ("2026-12-03", or the date part of a timestamp) as "3 Dec 2026"; anything else comes back as it was. */
export function dateInWords(isoDate: string): string {
  const match = /^(\d{4}-\d{2}-\d{2})/.exec(isoDate);
  const date = match ? new Date(`${match[1]}T00:00:00Z`) : new Date(Number.NaN);
  return Number.isNaN(date.getTime()) ? isoDate : calendar.format(date);
}

/** An instant as "3 Dec 2026, 21:05" in the given zone (the reader's own when none is given). */
export function dateTimeInWords(instant: Date, timeZone?: string): string {
  const { date, time } = formattersFor(timeZone);
  return `${date.format(instant)}, ${time.format(instant)}`;
}

/** The calendar day of an instant in the given zone (the reader's own when none is given): "3 Dec 2026". */
export function dayInWords(instant: Date, timeZone?: string): string {
  return formattersFor(timeZone).date.format(instant);
}

/** An instant's clock time alone, "21:05". */
export function timeInWords(instant: Date, timeZone?: string): string {
  return formattersFor(timeZone).time.format(instant);
}
