import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema } from '@shared/schemas/users';
import { api } from '../../../lib/api-client';
import { userKeys } from './user-keys';

export interface UserAccessChange {
  id: string;
  disable: boolean;
}

function describe(data: unknown): string {
  const { user } = userResponseSchema.parse(data);
  return user.disabled ? `${user.name} can no longer sign in.` : `${user.name} can sign in again.`;
}

export function useSetUserAccess() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, disable }: UserAccessChange) =>
      api.post(`/api/users/${encodeURIComponent(id)}/${disable ? 'disable' : 'enable'}`, undefined, userResponseSchema),
    meta: { successToast: describe },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}
