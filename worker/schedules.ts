import type { Queue } from 'bullmq';
import { JOBS } from '../shared/jobs/catalogue';

// upsertJobScheduler is idempotent: any number of worker processes starting leaves one schedule.
export async function upsertSchedules(maintenance: Queue): Promise<void> {
  await maintenance.upsertJobScheduler('prune-sessions-hourly', { every: 60 * 60 * 1000 }, { name: JOBS.pruneSessions.name, data: {} });
}
