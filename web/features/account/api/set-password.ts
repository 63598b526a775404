import { useMutation, useQueryClient } from '@tanstack/react-query';
import { setPasswordResponseSchema, type SetPasswordInput } from '@shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { accountKeys } from './account-keys';

export function useSetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SetPasswordInput) => api.post('/api/account/set-password', input, setPasswordResponseSchema, { redirectOn401: false }),
    meta: { inlineErrors: ['validation_failed', 'link_invalid'] },
    // A link works once: forget what it said about its owner.
    onSuccess: () => queryClient.removeQueries({ queryKey: accountKeys.setupLinks() }),
  });
}
