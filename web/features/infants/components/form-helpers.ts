import { get, type FieldError, type FieldErrors, type FieldValues } from 'react-hook-form';

/**
 * The message for one field. zod's generic type message ("expected number, received undefined") only ever means
 * the box was left empty, so a plain "Enter …" replaces it where the shared schema has no wording of its own.
 */
export function errorText<T extends FieldValues>(errors: FieldErrors<T>, path: string, whenEmpty?: string): string | undefined {
  const error = get(errors, path) as FieldError | undefined;
  if (!error?.message) return undefined;
  if (whenEmpty && error.type === 'invalid_type') return whenEmpty;
  return error.message;
}

/** Today's date (YYYY-MM-DD) where the programme is, not where the browser happens to be. */
export function todayIn(timeZone: string, now = new Date()): string {
  try {
    return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
  } catch {
    return now.toISOString().slice(0, 10);
  }
}
