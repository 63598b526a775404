import type { Queue } from 'bullmq';
import type { AppRepos } from '../../deps';
import { addReminderJobs, type ReminderJobOptions } from '../../jobs/reminder-jobs';
import { REMINDER_LOOK_AHEAD_MS } from '../../jobs/producer';

const BATCH = 5000;

/**
 * PostgreSQL is the source of truth: every scheduled reminder due within the look-ahead is (re-)added to the queue
 * under its own id. A job that is already waiting, delayed or running makes the add a no-op, so this heals a lost
 * Redis, a crashed worker or an API that could not reach Redis, and never doubles a delivery.
 */
export async function reconcileReminders(repos: AppRepos, queue: Queue, opts: ReminderJobOptions): Promise<number> {
  let total = 0;
  const due = await repos.reminders.due(REMINDER_LOOK_AHEAD_MS, BATCH);
  for (let i = 0; i < due.length; i += 500) await addReminderJobs(queue, due.slice(i, i + 500), opts);
  total += due.length;
  return total;
}
