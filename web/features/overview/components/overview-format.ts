export const plural = (n: number, one: string, many: string) => `${n === 1 ? one : many}`;

/** "3 days", "5 hours", "under an hour": how long the oldest item has waited, measured at the server's "now". */
export function waitedFor(since: string, asOf: string): string {
  const ms = Date.parse(asOf) - Date.parse(since);
  const days = Math.floor(ms / 86_400_000);
  if (days >= 1) return `${days} ${plural(days, 'day', 'days')}`;
  const hours = Math.floor(ms / 3_600_000);
  return hours >= 1 ? `${hours} ${plural(hours, 'hour', 'hours')}` : 'under an hour';
}

/** An instant as the programme's calendar shows it ("12 November 2026"), wherever the browser is. */
export const longDate = (iso: string, timeZone: string) =>
  new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone }).format(new Date(iso));
/** "Monday 30 November" in the programme's time zone. */
export const dayAndDate = (iso: string, timeZone: string) =>
  new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', timeZone }).format(new Date(iso));
/** A calendar date (YYYY-MM-DD) in words; it has no time zone, so it is read as one. */
export const calendarDate = (ymd: string) => longDate(`${ymd}T00:00:00Z`, 'UTC');
