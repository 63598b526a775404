import { TZDate } from '@date-fns/tz';

const HOUR_MS = 3_600_000;

/**
 * A wall-clock date and time in a time zone → the instant, or null when that local time does not exist (the hour
 * skipped when clocks go forward, or a whole skipped day). In the repeated period when clocks go back, the earlier
 * of the two is used, whatever the size of the change (an hour in most zones, 30 minutes on Lord Howe Island).
 */
export function localToInstant(date: string, time: string, timeZone: string): Date | null {
  const [y, m, d] = date.split('-').map(Number);
  const [hh, mm] = time.split(':').map(Number);
  const t = new TZDate(y, m - 1, d, hh, mm, 0, timeZone);
  // A time that does not exist rolls over to a later one. The year is not compared: it only rolls over together
  // with the month, which is.
  const same = t.getMonth() === m - 1 && t.getDate() === d && t.getHours() === hh && t.getMinutes() === mm;
  if (!same) return null;
  // TZDate may settle on the later of two equal wall-clock times. Clocks went back just before `t` when the offset
  // three hours earlier was larger; the same wall-clock time that much earlier is then the first pass.
  const offsetMs = (ms: number) => -new TZDate(ms, timeZone).getTimezoneOffset() * 60_000;
  const shiftMs = offsetMs(t.getTime() - 3 * HOUR_MS) - offsetMs(t.getTime());
  if (shiftMs > 0) {
    const earlier = new TZDate(t.getTime() - shiftMs, timeZone);
    if (earlier.getHours() === hh && earlier.getMinutes() === mm) return new Date(earlier.getTime());
  }
  return new Date(t.getTime());
}
