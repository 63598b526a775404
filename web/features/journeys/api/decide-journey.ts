import { useMutation, useQueryClient } from '@tanstack/react-query';
import { journeyResponseSchema, journeySchema, type JourneyDecisionInput } from '@shared/schemas/journeys';
import { api } from '../../../lib/api-client';
import { isApiError } from '../../../lib/api-error';
import { journeyKeys } from './journey-keys';

const describe = (data: unknown) => {
  const journey = journeySchema.parse(data);
  const verb = journey.status === 'approved' ? 'approved' : 'not approved';
  return `${journey.infantName}: the journey plan to ${journey.request.destinationName} is ${verb}.`;
};

export function useDecideJourney(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: JourneyDecisionInput) =>
      (await api.post(`/api/journeys/${encodeURIComponent(id)}/decision`, input, journeyResponseSchema)).journey,
    // Field problems go beside the fields and a 409 has its own message on the page, so no toast repeats them.
    meta: { inlineErrors: ['validation_failed', 'conflict'], successToast: describe },
    onSuccess: (journey) => {
      queryClient.setQueryData(journeyKeys.detail(id), { journey });
      return queryClient.invalidateQueries({ queryKey: journeyKeys.all });
    },
    onError: (error) => {
      // Someone else decided first: show what it is now rather than a stale request.
      if (isApiError(error) && error.status === 409) return queryClient.invalidateQueries({ queryKey: journeyKeys.all });
    },
  });
}
