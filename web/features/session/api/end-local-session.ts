import type { QueryClient } from '@tanstack/react-query';
import { sessionKeys, sessionQueryOptions } from './session-keys';

// The apps (query clients) whose last session was ended by the person signing out, not by the server.
const signedOutOnPurpose = new WeakSet<QueryClient>();

/**
 * Forget the signed-in person in this tab: the session guard then shows sign-in, and nothing read as them
 * stays in the cache for the next person on a shared ward computer. `signed-out` when the person chose to.
 */
export function endLocalSession(queryClient: QueryClient, how: 'expired' | 'signed-out' = 'expired'): void {
  if (how === 'signed-out') signedOutOnPurpose.add(queryClient);
  else signedOutOnPurpose.delete(queryClient);
  const previous = queryClient.getQueryData(sessionQueryOptions().queryKey);
  queryClient.setQueryData(sessionQueryOptions().queryKey, { user: null, csrfToken: previous?.csrfToken ?? '' });
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
  // The server hands out a new CSRF token with the new anonymous session.
  void queryClient.invalidateQueries({ queryKey: sessionKeys.all });
}

/**
 * Whether the person signed out on purpose: sign-in then names no page to return to, which would tell the next
 * person on a shared computer which page (which baby) was open. A session that ran out keeps its page.
 */
export function endedBySigningOut(queryClient: QueryClient): boolean {
  return signedOutOnPurpose.has(queryClient);
}

/** A new session has begun: a later expiry keeps its page again. */
export function startLocalSession(queryClient: QueryClient): void {
  signedOutOnPurpose.delete(queryClient);
}
