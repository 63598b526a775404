import { Queue } from 'bullmq';
import { afterAll, describe, expect, it } from 'vitest';
import { QUEUES } from '@shared/jobs/catalogue';
import { redisConnection } from '../../worker/queues';
import { upsertSchedules } from '../../worker/schedules';

// R6 (docs/service-targets.md): job schedulers upserted from two processes at once leave one schedule each and no duplicate jobs.
const prefix = `sched${Math.random().toString(36).slice(2, 8)}`;
const connection = redisConnection(process.env.REDIS_URL ?? 'redis://127.0.0.1:63809');
const queues = [new Queue(QUEUES.maintenance, { connection, prefix }), new Queue(QUEUES.maintenance, { connection, prefix })];
afterAll(async () => {
  await queues[0].obliterate({ force: true });
  await Promise.all(queues.map((q) => q.close()));
});

describe('job schedules', () => {
  it('when two workers start at the same moment (and one again after a Redis reconnect), then each schedule exists once with one next job', async () => {
    await Promise.all(queues.map((q) => upsertSchedules(q, { reconcileRemindersMs: 30_000 })));
    await upsertSchedules(queues[1], { reconcileRemindersMs: 30_000 });
    const schedulers = await queues[0].getJobSchedulers();
    expect(schedulers.map((s) => s.key).sort()).toEqual(['daily-schedule', 'plan-digests', 'prune-sessions-hourly', 'reanalyse-recordings', 'reconcile-conversions', 'reconcile-reminders', 'verify-audit-chain']);
    const next = await queues[0].getJobs(['delayed', 'waiting', 'prioritized']);
    const perScheduler = new Map<string, number>();
    for (const job of next) perScheduler.set(String(job.repeatJobKey), (perScheduler.get(String(job.repeatJobKey)) ?? 0) + 1);
    expect([...perScheduler.values()].every((n) => n === 1)).toBe(true);
    expect(perScheduler.size).toBe(7);
  });
});
