import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import type { EmailLetterInput } from '@shared/schemas/discharge';
import { api } from '../../../lib/api-client';

const sentSchema = z.object({ sentTo: z.string(), filename: z.string() });

export function useEmailDischargeLetter(infantId: string) {
  return useMutation({
    mutationFn: (input: EmailLetterInput) => api.post(`/api/infants/${encodeURIComponent(infantId)}/discharge-letter/email`, input, sentSchema),
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found', 'unavailable'] },
  });
}
