import { UnrecoverableError, type Job } from 'bullmq';
import { JOBS } from '@shared/jobs/catalogue';
import type { Delivery } from '../../server/modules/reminders/delivery';

/** One message: the delivery service decides (send, skip, hold, settle an uncertain attempt); throwing means retry. */
export async function deliverReminderProcessor(job: Job, delivery: Delivery) {
  const p = JOBS.deliverReminder.payload.safeParse(job.data);
  if (!p.success) throw new UnrecoverableError('deliver-reminder: bad payload');
  const finalAttempt = job.attemptsMade + 1 >= (job.opts.attempts ?? 1);
  return delivery.deliver(p.data.reminderId, { finalAttempt });
}
