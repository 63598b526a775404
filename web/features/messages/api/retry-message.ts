import { useMutation, useQueryClient } from '@tanstack/react-query';
import { messageResponseSchema } from '@shared/schemas/messages';
import { api } from '../../../lib/api-client';
import { messageKeys } from './message-keys';

function describe(data: unknown): string {
  const { message } = messageResponseSchema.parse(data);
  return `The message to ${message.recipient.name} will be sent again.`;
}

/** Asks the server to try a failed message once more; the row's new state comes with the refreshed list. */
export function useRetryMessage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post(`/api/messages/${encodeURIComponent(id)}/retry`, undefined, messageResponseSchema),
    meta: { successToast: describe },
    // Refused or not, the row may have moved on (sent meanwhile, or retried by a colleague): show its state now.
    onSettled: () => queryClient.invalidateQueries({ queryKey: messageKeys.lists() }),
  });
}
