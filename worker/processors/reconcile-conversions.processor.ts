import type { AppRepos } from '../../server/deps';
import type { JobProducer } from '../../server/jobs/producer';

/**
 * PostgreSQL is the source of truth: a proposal left 'preparing' (Redis was away when it was enqueued, or a job was
 * lost) is enqueued again under its fixed job id, which BullMQ ignores if the job still exists.
 */
export async function reconcileConversions(repos: AppRepos, jobs: JobProducer, olderThanSeconds = 30) {
  const ids = await repos.prescriptions.stalePreparing(olderThanSeconds);
  for (const id of ids) await jobs.enqueueConversion(id);
  return { requeued: ids.length };
}
