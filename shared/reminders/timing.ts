import { TZDate } from '@date-fns/tz';
import { addDays } from '../clinical/dates';
import { localToInstant } from '../schedule/local-time';

export interface QuietHours {
  /** 'HH:mm' local; no message starts in [quietStart, quietEnd). Equal times mean no quiet hours. */
  quietStart: string;
  quietEnd: string;
}

const minutesOf = (hhmm: string) => {
  const [h, m] = hhmm.split(':').map(Number);
  return h * 60 + m;
};
const two = (n: number) => String(n).padStart(2, '0');

/** The wall-clock date and time of an instant in a time zone. */
export function localParts(instant: Date, timeZone: string): { date: string; time: string } {
  const t = new TZDate(instant.getTime(), timeZone);
  return { date: `${t.getFullYear()}-${two(t.getMonth() + 1)}-${two(t.getDate())}`, time: `${two(t.getHours())}:${two(t.getMinutes())}` };
}

export function inQuietHours(instant: Date, timeZone: string, q: QuietHours): boolean {
  const start = minutesOf(q.quietStart);
  const end = minutesOf(q.quietEnd);
  if (start === end) return false;
  const now = minutesOf(localParts(instant, timeZone).time);
  // A window that crosses midnight (21:00–08:00) is the usual case.
  return start < end ? now >= start && now < end : now >= start || now < end;
}

/**
 * A local wall-clock time that may fall in the hour skipped when the clocks go forward: then the first minute that
 * exists after it is used, so a held message is never dropped by a clock change.
 */
export function instantAtOrAfter(date: string, time: string, timeZone: string): Date {
  const exact = localToInstant(date, time, timeZone);
  if (exact) return exact;
  let minutes = minutesOf(time);
  for (let step = 0; step < 180; step += 1) {
    minutes += 1;
    const t = localToInstant(date, `${two(Math.floor(minutes / 60) % 24)}:${two(minutes % 60)}`, timeZone);
    if (t) return t;
  }
  throw new RangeError(`No valid local time after ${date} ${time} in ${timeZone}`);
}

/** The instant itself outside quiet hours, otherwise the end of the quiet hours that contain it. */
export function outsideQuietHours(instant: Date, timeZone: string, q: QuietHours): Date {
  if (!inQuietHours(instant, timeZone, q)) return instant;
  const local = localParts(instant, timeZone);
  // Before the end time on the same local day (early morning) → that morning; otherwise (late evening) → next morning.
  const date = minutesOf(local.time) < minutesOf(q.quietEnd) ? local.date : addDays(local.date, 1);
  const end = instantAtOrAfter(date, q.quietEnd, timeZone);
  if (end.getTime() > instant.getTime()) return end;
  // In the hour repeated when clocks go back, the first of two equal wall-clock times can lie before the instant
  // itself (quiet until 01:30, now 01:10 the second time round): the end is then the second 01:30.
  const offsetMs = (at: Date) => -new TZDate(at.getTime(), timeZone).getTimezoneOffset() * 60_000;
  return new Date(end.getTime() + offsetMs(end) - offsetMs(instant));
}

export interface VisitTiming {
  /** The family's local date and time of the visit and their time zone. */
  date: string;
  time: string;
  timeZone: string;
  startsAt: Date;
}

export interface ReminderRules extends QuietHours {
  dayBeforeAt: string;
  morningOfAt: string;
}

export type PlannedReminder =
  | { template: 'visit-day-before' | 'visit-morning'; sendAt: Date; notAfter: Date; skip: null }
  | { template: 'visit-day-before' | 'visit-morning'; sendAt: Date; notAfter: Date; skip: 'quiet-hours' };

/** A reminder later than this before the visit is no use to the family. */
export const LAST_USEFUL_MINUTES_BEFORE_VISIT = 15;
/** A reminder whose time passed no more than this ago still goes (a booking made a few minutes late, a slow queue). */
export const LATE_GRACE_MINUTES = 10;

/**
 * The family's two visit reminders: the day before at dayBeforeAt and on the day at morningOfAt, both their local
 * time, held past quiet hours. One whose time has already passed is not planned; one that quiet hours would push
 * past the start of the visit is planned as skipped, so the message log shows why the family heard nothing.
 */
export function planVisitReminders(visit: VisitTiming, rules: ReminderRules, now: Date): PlannedReminder[] {
  const notAfter = new Date(visit.startsAt.getTime() - LAST_USEFUL_MINUTES_BEFORE_VISIT * 60_000);
  const wanted = [
    { template: 'visit-day-before' as const, at: instantAtOrAfter(addDays(visit.date, -1), rules.dayBeforeAt, visit.timeZone) },
    { template: 'visit-morning' as const, at: instantAtOrAfter(visit.date, rules.morningOfAt, visit.timeZone) },
  ];
  const out: PlannedReminder[] = [];
  for (const w of wanted) {
    const sendAt = outsideQuietHours(w.at, visit.timeZone, rules);
    if (sendAt.getTime() < now.getTime() - LATE_GRACE_MINUTES * 60_000) continue;
    if (sendAt.getTime() > notAfter.getTime() && w.at.getTime() <= notAfter.getTime()) {
      out.push({ template: w.template, sendAt, notAfter, skip: 'quiet-hours' });
      continue;
    }
    // A morning time set after the visit itself (an 07:00 visit, an 08:00 reminder) is simply not useful.
    if (sendAt.getTime() > notAfter.getTime()) continue;
    out.push({ template: w.template, sendAt, notAfter, skip: null });
  }
  return out;
}

/** A change note (moved, cancelled) goes now, or when quiet hours end. */
export function changeNoteAt(now: Date, timeZone: string, q: QuietHours): Date {
  return outsideQuietHours(now, timeZone, q);
}

/** The day-before reminder for a journey departing on a local date. */
export function journeyReminderAt(departOn: string, timeZone: string, rules: ReminderRules): Date {
  return outsideQuietHours(instantAtOrAfter(addDays(departOn, -1), rules.dayBeforeAt, timeZone), timeZone, rules);
}

export type PlannedBookingNote =
  | { template: 'visit-booked' | 'visit-today'; sendAt: Date; notAfter: Date; skip: null }
  | { template: 'visit-today'; sendAt: Date; notAfter: Date; skip: 'quiet-hours' };

/**
 * The note that tells a family a visit was booked, so a later "moved" or "cancelled" message refers to something
 * they were told. It goes now, or when quiet hours end. When that moment falls on the visit's own local day it is
 * the short "today at …" note (and replaces that morning's reminder); one that quiet hours would hold until after
 * the visit has started is planned as skipped, so the log shows why. A visit already started gets none.
 */
export function planBookingNote(visit: VisitTiming, q: QuietHours, now: Date): PlannedBookingNote | null {
  const notAfter = visit.startsAt;
  if (notAfter.getTime() <= now.getTime()) return null;
  const sendAt = outsideQuietHours(now, visit.timeZone, q);
  if (sendAt.getTime() >= notAfter.getTime()) return { template: 'visit-today', sendAt, notAfter, skip: 'quiet-hours' };
  const template = localParts(sendAt, visit.timeZone).date === visit.date ? 'visit-today' : 'visit-booked';
  return { template, sendAt, notAfter, skip: null };
}
