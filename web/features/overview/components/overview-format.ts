const dayMonthYear = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric' });
const weekday = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long' });

export const plural = (n: number, one: string, many: string) => `${n === 1 ? one : many}`;

/** "3 days", "5 hours", "under an hour": how long the oldest item has waited, measured at the server's "now". */
export function waitedFor(since: string, asOf: string): string {
  const ms = Date.parse(asOf) - Date.parse(since);
  const days = Math.floor(ms / 86_400_000);
  if (days >= 1) return `${days} ${plural(days, 'day', 'days')}`;
  const hours = Math.floor(ms / 3_600_000);
  return hours >= 1 ? `${hours} ${plural(hours, 'hour', 'hours')}` : 'under an hour';
}

export const longDate = (iso: string) => dayMonthYear.format(new Date(iso));
export const dayAndDate = (iso: string) => weekday.format(new Date(iso));
