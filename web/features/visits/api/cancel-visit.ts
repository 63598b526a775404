import { useMutation, useQueryClient } from '@tanstack/react-query';
import { visitSchema, type Visit } from '@shared/schemas/visits';
import { api } from '../../../lib/api-client';
import { visitKeys } from './visit-keys';

export function useCancelVisit(visit: Visit) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => api.post(`/api/visits/${encodeURIComponent(visit.id)}/cancel`, { reason }, visitSchema),
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'], successToast: () => 'Visit cancelled.' },
    // A 409 means it was already cancelled or done elsewhere: the list shows what is true now.
    onSettled: () => queryClient.invalidateQueries({ queryKey: visitKeys.list(visit.infantId) }),
  });
}
