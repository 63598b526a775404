import { useMutation, useQueryClient } from '@tanstack/react-query';
import { visitSchema, type Visit } from '@shared/schemas/visits';
import { api } from '../../../lib/api-client';
import { visitKeys } from './visit-keys';

export function useCompleteVisit(visit: Visit) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post(`/api/visits/${encodeURIComponent(visit.id)}/done`, { rowVersion: visit.rowVersion }, visitSchema),
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'], successToast: () => 'Visit marked done.' },
    // A 409 means it was changed, cancelled or done elsewhere, or is still to come: the list shows what is true now.
    onSettled: () => queryClient.invalidateQueries({ queryKey: visitKeys.list(visit.infantId) }),
  });
}
