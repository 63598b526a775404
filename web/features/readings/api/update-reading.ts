import { useMutation, useQueryClient } from '@tanstack/react-query';
import { readingSchema, type UpdateReadingInput } from '@shared/schemas/readings';
import { apiRequest } from '../../../lib/api-client';
import { readingKeys } from './reading-keys';

export function useUpdateReading(readingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateReadingInput) =>
      apiRequest(`/api/readings/${encodeURIComponent(readingId)}`, { method: 'PATCH', body: input, schema: readingSchema }),
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'], successToast: () => 'Reading corrected.' },
    onSuccess: (reading) => {
      queryClient.setQueryData(readingKeys.detail(reading.infantId, reading.id), reading);
      return queryClient.invalidateQueries({ queryKey: readingKeys.list(reading.infantId) });
    },
  });
}
