import { useMutation, useQueryClient } from '@tanstack/react-query';
import { visitSchema, type MoveVisitInput, type Visit } from '@shared/schemas/visits';
import { apiRequest } from '../../../lib/api-client';
import { visitKeys } from './visit-keys';

export function useMoveVisit(visit: Visit) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: MoveVisitInput) =>
      apiRequest(`/api/visits/${encodeURIComponent(visit.id)}`, { method: 'PATCH', body: input, schema: visitSchema }),
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'], successToast: () => 'Visit moved.' },
    // A 409 means someone else changed it: read the list again so the next try starts from their version.
    onSettled: () => queryClient.invalidateQueries({ queryKey: visitKeys.list(visit.infantId) }),
  });
}
