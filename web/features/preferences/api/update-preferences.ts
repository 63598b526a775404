import { useMutation, useQueryClient } from '@tanstack/react-query';
import { preferencesResponseSchema, type UpdatePreferencesInput } from '@shared/schemas/preferences';
import { apiRequest } from '../../../lib/api-client';
import { preferenceKeys } from './preference-keys';

export const SAVED_MESSAGE = 'Saved — we have noted this change';

export function useUpdatePreferences(onSaved?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdatePreferencesInput) =>
      apiRequest('/api/me/preferences', { method: 'PUT', body: input, schema: preferencesResponseSchema }),
    // Field problems sit beside the fields and a stale version has its own message with a reload; the page confirms a
    // save itself, with focus on the note (SAVED_MESSAGE), so no toast repeats any of them.
    meta: { inlineErrors: ['validation_failed', 'conflict'] },
    // Here rather than per call: the form is replaced by a fresh one for the new version as soon as the data lands.
    onSuccess: (data) => {
      queryClient.setQueryData(preferenceKeys.mine(), data);
      onSaved?.();
    },
  });
}
