import { useMutation, useQueryClient } from '@tanstack/react-query';
import { visitSchema, VISIT_KIND_LABELS, type BookVisitInput } from '@shared/schemas/visits';
import { api } from '../../../lib/api-client';
import { visitKeys } from './visit-keys';

function describe(data: unknown): string {
  const visit = visitSchema.parse(data);
  return `${VISIT_KIND_LABELS[visit.kind]} booked for ${visit.date} at ${visit.time}.`;
}

export function useBookVisit(infantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BookVisitInput) => api.post(`/api/infants/${encodeURIComponent(infantId)}/visits`, input, visitSchema),
    // Field problems sit beside the fields and the rest above the form, so no toast repeats them.
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'], successToast: describe },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: visitKeys.list(infantId) }),
  });
}
