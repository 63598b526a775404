import { useMutation, useQueryClient } from '@tanstack/react-query';
import { signInResponseSchema, type SignInInput } from '@shared/schemas/session';
import { api } from '../../../lib/api-client';
import { startLocalSession } from './end-local-session';
import { sessionKeys, sessionQueryOptions } from './session-keys';

export const SIGN_IN_INLINE_ERRORS = ['invalid_credentials', 'rate_limited', 'validation_failed', 'unauthenticated'] as const;

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) =>
      api.post('/api/session', input, signInResponseSchema, { redirectOn401: false }),
    meta: { inlineErrors: SIGN_IN_INLINE_ERRORS },
    onSuccess: ({ user, csrfToken }) => {
      startLocalSession(queryClient);
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
      // The server regenerates the session on sign-in and sends the new CSRF token with the user.
      queryClient.setQueryData(sessionQueryOptions().queryKey, { user, csrfToken });
    },
  });
}
