import type { DayItem } from '@shared/schemas/schedule';

// Due dates are calendar days in the programme's zone; reading them at noon UTC keeps the same day everywhere.
const shortDay = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
const longDay = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', timeZone: 'UTC' });

const atNoon = (date: string) => new Date(`${date}T12:00:00Z`);

export const formatShortDay = (date: string) => shortDay.format(atNoon(date));
export const formatLongDay = (date: string) => longDay.format(atNoon(date));

/** Said in words, so an overdue check never depends on colour to be noticed. */
export function dueText(item: Pick<DayItem, 'status' | 'dueDate'>, today: string): string {
  if (item.status === 'overdue' || item.dueDate < today) return `Overdue since ${formatShortDay(item.dueDate)}`;
  return 'Due today';
}

export const isOverdue = (item: Pick<DayItem, 'status' | 'dueDate'>, today: string) => item.status === 'overdue' || item.dueDate < today;

export function countText(count: number): string {
  return count === 1 ? '1 check' : `${count} checks`;
}

/** An overnight study is completed by its recording, not by a spot reading taken at the door. */
export const completesWithReading = (item: Pick<DayItem, 'kind'>) => item.kind === 'spot_check';

export function visitCountText(count: number): string {
  return count === 1 ? '1 visit' : `${count} visits`;
}

/** "45 minutes", "1 hour", "1 hour 30 minutes". */
export function lengthText(minutes: number): string {
  const hours = Math.floor(minutes / 60);
  const rest = minutes % 60;
  const parts = [
    hours > 0 ? `${hours} ${hours === 1 ? 'hour' : 'hours'}` : '',
    rest > 0 || hours === 0 ? `${rest} ${rest === 1 ? 'minute' : 'minutes'}` : '',
  ];
  return parts.filter(Boolean).join(' ');
}

const clockTime = new Intl.DateTimeFormat('en-GB', { timeStyle: 'short' });

/** "11:40", in the device's zone: when a check was done today. */
export const doneTimeText = (iso: string | null): string => (iso ? clockTime.format(new Date(iso)) : 'today');
