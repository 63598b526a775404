import { useMutation, useQueryClient } from '@tanstack/react-query';
import { journeyResponseSchema, type CreateJourneyInput } from '@shared/schemas/journeys';
import { api } from '../../../lib/api-client';
import { journeyKeys } from './journey-keys';

export function useCreateJourney(infantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: CreateJourneyInput) =>
      (await api.post(`/api/infants/${encodeURIComponent(infantId)}/journeys`, input, journeyResponseSchema)).journey,
    // The form shows every refusal itself (beside the fields or above them), so no toast repeats it.
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'] },
    onSuccess: (journey) => {
      queryClient.setQueryData(journeyKeys.detail(journey.id), { journey });
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: journeyKeys.list(infantId) }),
        queryClient.invalidateQueries({ queryKey: journeyKeys.waiting() }),
      ]);
    },
  });
}
