import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateUserInput } from '@shared/schemas/users';
import { invitationResponseSchema } from '@shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { userKeys } from './user-keys';

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateUserInput) => api.post('/api/users', input, invitationResponseSchema),
    meta: { inlineErrors: ['validation_failed', 'conflict'] },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}
