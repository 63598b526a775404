import type { Queue } from 'bullmq';
import { JOBS, reminderJobId } from '@shared/jobs/catalogue';

export interface ReminderJobOptions {
  attempts: number;
  backoffMs: number;
}

/**
 * Delivery jobs for reminder rows, delayed to their send time. Finished jobs are removed (completed or finally
 * failed) so that the id is free again: PostgreSQL, not Redis, remembers what was sent.
 */
export async function addReminderJobs(queue: Queue, rows: ReadonlyArray<{ id: string; send_at: Date | string }>, opts: ReminderJobOptions, now = Date.now()) {
  if (rows.length === 0) return;
  await queue.addBulk(rows.map((r) => ({
    name: JOBS.deliverReminder.name,
    data: JOBS.deliverReminder.payload.parse({ reminderId: r.id }),
    opts: {
      jobId: reminderJobId(r.id),
      delay: Math.max(0, new Date(r.send_at).getTime() - now),
      attempts: opts.attempts,
      backoff: { type: 'exponential', delay: opts.backoffMs },
      removeOnComplete: true,
      removeOnFail: true,
    },
  })));
}
