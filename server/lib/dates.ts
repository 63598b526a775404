/** The calendar date in a time zone, as YYYY-MM-DD; ages and schedules are in the family's or programme's day. */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}
