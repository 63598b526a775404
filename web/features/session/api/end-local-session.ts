import type { QueryClient } from '@tanstack/react-query';
import { sessionKeys, sessionQueryOptions } from './session-keys';

/**
 * Forget the signed-in person in this tab: the session guard then shows sign-in, and nothing read as them
 * stays in the cache for the next person on a shared ward computer.
 */
export function endLocalSession(queryClient: QueryClient): void {
  const previous = queryClient.getQueryData(sessionQueryOptions().queryKey);
  queryClient.setQueryData(sessionQueryOptions().queryKey, { user: null, csrfToken: previous?.csrfToken ?? '' });
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
  // The server hands out a new CSRF token with the new anonymous session.
  void queryClient.invalidateQueries({ queryKey: sessionKeys.all });
}
