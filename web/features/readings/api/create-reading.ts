import { useMutation, useQueryClient } from '@tanstack/react-query';
import { readingSchema, type CreateReadingInput } from '@shared/schemas/readings';
import { api } from '../../../lib/api-client';
import { readingKeys } from './reading-keys';

const NEW_WEIGHT_NOTE = 'New weight saved: a new setting is being worked out for the consultant.';

function describe(data: unknown): string {
  const reading = readingSchema.parse(data);
  return reading.weightKg !== null ? `Reading saved. ${NEW_WEIGHT_NOTE}` : 'Reading saved.';
}

export function useCreateReading(infantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateReadingInput) =>
      api.post(`/api/infants/${encodeURIComponent(infantId)}/readings`, input, readingSchema),
    // Field problems sit beside the fields and the rest above the form, so no toast repeats them.
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'], successToast: describe },
    onSuccess: (reading) => {
      queryClient.setQueryData(readingKeys.detail(reading.infantId, reading.id), reading);
      return queryClient.invalidateQueries({ queryKey: readingKeys.list(infantId) });
    },
  });
}
