import type { Journey, JourneyPeriod } from '@shared/schemas/journeys';
import { numberInWords } from '@shared/format/number-words';

// Journey dates are the family's calendar days; formatting them at UTC noon keeps any browser zone from moving them.
const asUtcNoon = (date: string) => new Date(`${date}T12:00:00Z`);
const longDay = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
const shortDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

export const dayWords = (date: string) => longDay.format(asUtcNoon(date));
export const shortDayWords = (date: string) => shortDay.format(asUtcNoon(date));

export function datesWords(request: Journey['request']): string {
  return request.departOn === request.returnOn
    ? `on ${dayWords(request.departOn)}`
    : `from ${dayWords(request.departOn)} to ${dayWords(request.returnOn)}`;
}

export const PERIOD_WORDS: Record<JourneyPeriod, string> = { awake: 'When awake', asleep: 'When asleep', feeding: 'When feeding' };

export function hoursWords(hours: number): string {
  return `${numberInWords(Number(hours.toFixed(1)))} ${hours === 1 ? 'hour' : 'hours'}`;
}

export function wayWords(request: Journey['request']): string {
  if (request.mode === 'road') {
    return request.destinationElevationM === null ? 'By road' : `By road, ${numberInWords(request.destinationElevationM)} m above sea level`;
  }
  const cabin = numberInWords(request.cabinAltitudeFt ?? 8000);
  const there = request.destinationElevationM === null ? '' : `; destination ${numberInWords(request.destinationElevationM)} m above sea level`;
  return `By air, planned for a cabin at ${cabin} ft${there}`;
}

/** The destination's elevation as the person asking entered it, for the consultant to check against the plan. */
export function destinationElevationWords(request: Journey['request']): string {
  if (request.destinationElevationM !== null) return `${numberInWords(request.destinationElevationM)} m above sea level`;
  return request.mode === 'flight' ? 'Not given: planned for the aircraft cabin only' : 'Not given';
}

/** YYYY-MM-DD in a time zone: the programme's calendar, which the server also checks dates against. */
export function todayIn(timeZone: string, now = new Date()): string {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(now);
  const part = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('year')}-${part('month')}-${part('day')}`;
}

/**
 * An approved trip shows in full on the family page from the moment it is approved until the day of return:
 * families need the approved figures early (airline forms ask for them weeks ahead).
 */
export function tripIsCurrent(journey: Journey, today: string): boolean {
  return journey.status === 'approved' && journey.plan !== null && today <= journey.request.returnOn;
}
