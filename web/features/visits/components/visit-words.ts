import { VISIT_KIND_LABELS, type Visit } from '@shared/schemas/visits';

// The date and time are the family's wall clock; formatting them in UTC keeps the browser's zone from shifting them.
const asUtcNoon = (date: string) => new Date(`${date}T12:00:00Z`);
const shortDay = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
const longDay = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', timeZone: 'UTC' });

const browserZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;

/** "Thu 3 Dec, 10:00", naming the family's zone when the person reading is elsewhere. */
export function visitWhen(visit: Visit): string {
  const when = `${shortDay.format(asUtcNoon(visit.date))}, ${visit.time}`;
  return visit.timeZone === browserZone() ? when : `${when} (family's time, ${visit.timeZone})`;
}

export const visitLength = (minutes: number) =>
  minutes < 60 || minutes % 60 !== 0 ? `${minutes} min` : `${minutes / 60} h`;

/** "Home visit on Thursday 3 December at 10:00 with Tobias Fenwright — Spot check and weight". */
export function visitSentence(visit: Visit): string {
  return `${VISIT_KIND_LABELS[visit.kind]} on ${longDay.format(asUtcNoon(visit.date))} at ${visit.time} with ${visit.staff.name} — ${visit.purpose}`;
}

const endsAt = (visit: Visit) => Date.parse(visit.startsAt) + visit.durationMinutes * 60_000;

/** Booked and not yet over, the next one first. */
export function upcomingVisits(visits: readonly Visit[], now: number): Visit[] {
  return visits
    .filter((visit) => visit.status === 'booked' && endsAt(visit) > now)
    .sort((a, b) => Date.parse(a.startsAt) - Date.parse(b.startsAt));
}

/** Booked visits whose time is over but that nobody has marked done (or moved, or cancelled): the oldest first. */
export function visitsToMarkDone(visits: readonly Visit[], now: number): Visit[] {
  return visits
    .filter((visit) => visit.status === 'booked' && endsAt(visit) <= now)
    .sort((a, b) => Date.parse(a.startsAt) - Date.parse(b.startsAt));
}

/** Cancelled or done (every booked visit is upcoming or waiting to be marked done): the newest first. */
export function earlierVisits(visits: readonly Visit[]): Visit[] {
  return visits.filter((visit) => visit.status !== 'booked').sort((a, b) => Date.parse(b.startsAt) - Date.parse(a.startsAt));
}
