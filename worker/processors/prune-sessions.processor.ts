import type { AppRepos } from '../../server/deps';

/** Removes expired sign-in sessions; idempotent, so a repeat run is harmless. */
export async function pruneSessions(repos: Pick<AppRepos, 'users'>): Promise<{ removed: number }> {
  return { removed: await repos.users.pruneExpiredSessions() };
}
