import { useMutation, useQueryClient } from '@tanstack/react-query';
import { preferencesResponseSchema, type UpdatePreferencesInput } from '../../../../shared/schemas/preferences';
import { apiRequest } from '../../../lib/api-client';
import { preferenceKeys } from './preference-keys';

export const SAVED_MESSAGE = 'Saved — we have noted this change';

export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdatePreferencesInput) =>
      apiRequest('/api/me/preferences', { method: 'PUT', body: input, schema: preferencesResponseSchema }),
    // Field problems sit beside the fields and a stale version has its own message with a reload, so no toast repeats them.
    meta: { inlineErrors: ['validation_failed', 'conflict'], successToast: () => SAVED_MESSAGE },
    onSuccess: (data) => queryClient.setQueryData(preferenceKeys.mine(), data),
  });
}
