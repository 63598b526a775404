import { dateInWords, dateTimeInWords, dayInWords } from '@shared/dates/date-words';

/** The web's one date style (see shared/dates/date-words.ts): "3 Dec 2026, 21:05" in the reader's own zone. */
export function formatDateTime(iso: string | null, empty = 'Never'): string {
  if (!iso) return empty;
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? empty : dateTimeInWords(date);
}

/** A calendar date ("2026-12-03") as "3 Dec 2026"; never shifted by the reader's zone. */
export function formatDate(isoDate: string | null | undefined, empty = '—'): string {
  return isoDate ? dateInWords(isoDate) : empty;
}

/** The day of an instant ("2026-12-03T10:00:00Z") as "3 Dec 2026" in the reader's own zone. */
export function formatDay(iso: string | null, empty = '—'): string {
  if (!iso) return empty;
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? empty : dayInWords(date);
}
