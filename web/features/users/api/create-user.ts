import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createUserResponseSchema, type CreateUserInput } from '../../../../shared/schemas/users';
import { api } from '../../../lib/api-client';
import { userKeys } from './user-keys';

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateUserInput) => api.post('/api/users', input, createUserResponseSchema),
    meta: { inlineErrors: ['validation_failed', 'conflict'] },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}
