import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { detailMessages, errorMessage, isApiError } from './api-error';

/**
 * Put a 400's per-field messages beside the fields the form has. Returns what is left to show above the form
 * (messages for fields it does not have), so no server message is silently dropped.
 */
export function applyServerFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
): string[] {
  if (!isApiError(error) || error.code !== 'validation_failed' || !error.details) return [];
  const leftover: string[] = [];
  for (const [field, messages] of Object.entries(error.details)) {
    const message = detailMessages(messages).join(' ');
    if ((fields as readonly string[]).includes(field)) setError(field as Path<T>, { type: 'server', message });
    else leftover.push(message);
  }
  return leftover;
}

/**
 * What to show above a form after a failed save: a server message for fields the form does not have (set on
 * `root.server`), else the error in words unless it was a 400 already shown beside the fields.
 */
export function formProblem(rootMessage: string | undefined, mutation: { isError: boolean; error: unknown }): string | undefined {
  const shownBesideFields = isApiError(mutation.error) && mutation.error.code === 'validation_failed';
  return rootMessage ?? (mutation.isError && !shownBesideFields ? errorMessage(mutation.error) : undefined);
}
