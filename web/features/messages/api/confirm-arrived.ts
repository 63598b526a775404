import { useMutation, useQueryClient } from '@tanstack/react-query';
import { messageResponseSchema } from '@shared/schemas/messages';
import { api } from '../../../lib/api-client';
import { messageKeys } from './message-keys';

function describe(data: unknown): string {
  const { message } = messageResponseSchema.parse(data);
  return `Recorded: the message reached ${message.recipient.name}. It will not be sent again.`;
}

/** The coordinator checked with the family that a message of unknown outcome did arrive. */
export function useConfirmArrived() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post(`/api/messages/${encodeURIComponent(id)}/arrived`, undefined, messageResponseSchema),
    meta: { successToast: describe },
    onSettled: () => queryClient.invalidateQueries({ queryKey: messageKeys.lists() }),
  });
}
