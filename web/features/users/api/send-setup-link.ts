import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema } from '@shared/schemas/users';
import { api } from '../../../lib/api-client';
import { userKeys } from './user-keys';

/** Admin: a new single-use set-up link by e-mail; the person's password stops working and their sessions end. */
export function useSendSetupLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post(`/api/users/${encodeURIComponent(id)}/setup-link`, undefined, userResponseSchema),
    meta: { successToast: (data: unknown) => `A new set-up link is on its way to ${userResponseSchema.parse(data).user.name}.` },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}
