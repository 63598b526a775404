import { useMutation } from '@tanstack/react-query';
import { letterSentSchema, type EmailLetterInput } from '@shared/schemas/discharge';
import { api } from '../../../lib/api-client';

export function useEmailDischargeLetter(infantId: string) {
  return useMutation({
    mutationFn: (input: EmailLetterInput) => api.post(`/api/infants/${encodeURIComponent(infantId)}/discharge-letter/email`, input, letterSentSchema),
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found', 'unavailable'] },
  });
}
