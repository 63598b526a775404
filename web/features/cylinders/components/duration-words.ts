const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;

/**
 * "5 hours and 20 minutes". Rounded down to the whole minute: a family must never be told a cylinder lasts
 * longer than it does.
 */
export function durationWords(minutes: number): string {
  const whole = Math.max(0, Math.floor(minutes + 1e-9));
  if (whole === 0) return minutes > 0 ? 'less than a minute' : 'no time at all';
  const hours = Math.floor(whole / 60);
  const rest = whole % 60;
  if (hours === 0) return plural(rest, 'minute');
  return rest === 0 ? plural(hours, 'hour') : `${plural(hours, 'hour')} and ${plural(rest, 'minute')}`;
}

const clock = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
const dayAndClock = new Intl.DateTimeFormat('en-GB', { weekday: 'long', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
const dateAndClock = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });

const sameDay = (a: Date, b: Date) => a.toDateString() === b.toDateString();

/** The device's own clock time after `minutes` (rounded down), e.g. "15:40" today, "Tuesday 03:10" within a week. */
export function clockAfter(minutes: number, now: Date): string {
  const at = new Date(now.getTime() + Math.floor(minutes) * 60_000);
  if (sameDay(at, now)) return `${clock.format(at)} today`;
  const days = (at.getTime() - now.getTime()) / 86_400_000;
  return days < 6 ? dayAndClock.format(at) : dateAndClock.format(at);
}
