import { TZDate } from '@date-fns/tz';

/**
 * A wall-clock date and time in a time zone → the instant, or null when that local time does not exist (the hour
 * skipped when clocks go forward). In the repeated hour when clocks go back, the earlier of the two is used.
 */
export function localToInstant(date: string, time: string, timeZone: string): Date | null {
  const [y, m, d] = date.split('-').map(Number);
  const [hh, mm] = time.split(':').map(Number);
  const t = new TZDate(y, m - 1, d, hh, mm, 0, timeZone);
  const same = t.getFullYear() === y && t.getMonth() === m - 1 && t.getDate() === d && t.getHours() === hh && t.getMinutes() === mm;
  if (!same) return null;
  // TZDate may settle on the later of two equal wall-clock times; prefer the earlier one when an hour earlier
  // shows the same local time.
  const earlier = new TZDate(t.getTime() - 3_600_000, timeZone);
  return earlier.getHours() === hh && earlier.getMinutes() === mm && earlier.getDate() === d ? new Date(earlier.getTime()) : new Date(t.getTime());
}
