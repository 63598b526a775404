// One formatter per time zone: building an Intl.DateTimeFormat costs far more than using one, and this runs on
// every request that shows ages or dates.
const formatters = new Map<string, Intl.DateTimeFormat>();

/** The calendar date in a time zone, as YYYY-MM-DD; ages and schedules are in the family's or programme's day. */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  let format = formatters.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
    formatters.set(timeZone, format);
  }
  return format.format(now);
}
