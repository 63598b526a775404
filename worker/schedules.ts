import type { Queue } from 'bullmq';
import { JOBS } from '@shared/jobs/catalogue';

// upsertJobScheduler is idempotent: any number of worker processes starting leaves one schedule each.
export async function upsertSchedules(maintenance: Queue, opts: { reconcileRemindersMs: number } = { reconcileRemindersMs: 30_000 }): Promise<void> {
  await maintenance.upsertJobScheduler('prune-sessions-hourly', { every: 60 * 60 * 1000 }, { name: JOBS.pruneSessions.name, data: {} });
  // Daily, shortly after midnight UTC: roll plans forward and mark what is now overdue.
  await maintenance.upsertJobScheduler('daily-schedule', { pattern: '5 0 * * *', tz: 'UTC' }, { name: JOBS.markOverdue.name, data: {} });
  // Messages: due reminders are (re-)enqueued from PostgreSQL; digests are planned for each programme's morning.
  await maintenance.upsertJobScheduler('reconcile-reminders', { every: opts.reconcileRemindersMs }, { name: JOBS.reconcileReminders.name, data: {} });
  await maintenance.upsertJobScheduler('plan-digests', { every: 10 * 60 * 1000 }, { name: JOBS.planDigests.name, data: {} });
  await maintenance.upsertJobScheduler('reanalyse-recordings', { every: 10 * 60 * 1000 }, { name: JOBS.reanalyseRecordings.name, data: {} });
  // Nightly, at a quiet hour: walk every audit hash chain (an admin can also check at any time).
  await maintenance.upsertJobScheduler('verify-audit-chain', { pattern: '40 2 * * *', tz: 'UTC' }, { name: JOBS.verifyAuditChain.name, data: {} });
  await maintenance.upsertJobScheduler('reconcile-conversions', { every: 60 * 1000 }, { name: JOBS.reconcileConversions.name, data: {} });
}
