import { Queue, type JobsOptions } from 'bullmq';
import { JOBS, QUEUES, conversionJobId, planDedupId, recordingJobId, replanJobId, type JobKey, type JobPayload } from '@shared/jobs/catalogue';
import { logEvery, type Logger } from '../lib/logger';
import { redisOptionsFromUrl } from '../lib/redis-url';
import { addReminderJobs, type ReminderJobOptions } from './reminder-jobs';

/** How far ahead due reminders are put on the queue (as delayed jobs); the rest wait in PostgreSQL. */
export const REMINDER_LOOK_AHEAD_MS = 2 * 60_000;

export interface JobProducer {
  enqueueConversion(prescriptionId: string): Promise<void>;
  enqueuePlanInfant(infantId: string): Promise<void>;
  enqueueReplanProgramme(programmeId: string, policyVersion: number): Promise<void>;
  enqueueAnalysis(recordingId: string): Promise<void>;
  /** Reminders due soon go to the queue at once; later ones are picked up by the reconciler nearer the time. */
  enqueueReminders(rows: ReadonlyArray<{ id: string; send_at: Date | string; status?: string }>): Promise<void>;
  close(): Promise<void>;
}

const JOB_OPTIONS = { attempts: 5, backoff: { type: 'exponential', delay: 2000 }, removeOnComplete: 1000, removeOnFail: 5000 } as const;

/**
 * Enqueues after the database commit. If Redis is away the row stays pending in PostgreSQL and the worker's
 * reconciler enqueues it later, so a failed enqueue is logged, never surfaced as a failed request.
 */
export function createJobProducer(redisUrl: string, prefix: string, logger: Logger, reminderOptions: ReminderJobOptions = { attempts: 6, backoffMs: 30_000 }): JobProducer {
  const connection = { ...redisOptionsFromUrl(redisUrl), enableOfflineQueue: false, maxRetriesPerRequest: 1 };
  const queues = new Map(Object.values(QUEUES).map((name) => [name, new Queue(name, { prefix, connection })]));
  // A lost connection is logged (once a minute at most while it lasts); the enqueue itself falls back below.
  const onError = logEvery(60_000, (err: Error) => logger.warn('job queue connection error', { err: err.message }));
  for (const q of queues.values()) q.on('error', onError);

  async function add<K extends JobKey>(key: K, data: JobPayload<K>, options: JobsOptions) {
    const job = JOBS[key];
    try {
      await queues.get(job.queue)!.add(job.name, job.payload.parse(data), { ...JOB_OPTIONS, ...options });
    } catch (err) {
      logger.warn('enqueue deferred to reconciler', { job: job.name, err: (err as Error).message });
    }
  }

  return {
    enqueueConversion: (prescriptionId) => add('convertPrescription', { prescriptionId }, { jobId: conversionJobId(prescriptionId) }),
    enqueuePlanInfant: (infantId) => add('planInfant', { infantId }, { deduplication: { id: planDedupId(infantId) } }),
    enqueueReplanProgramme: (programmeId, policyVersion) =>
      add('replanProgramme', { programmeId, policyVersion }, { jobId: replanJobId(programmeId, policyVersion) }),
    // A finally failed analysis job is removed so the reconciler can enqueue the still-unfinished recording again.
    enqueueAnalysis: (recordingId) => add('analyseRecording', { recordingId }, { jobId: recordingJobId(recordingId), removeOnFail: true }),
    async enqueueReminders(rows) {
      const soon = rows.filter((r) => (r.status ?? 'scheduled') === 'scheduled' && new Date(r.send_at).getTime() <= Date.now() + REMINDER_LOOK_AHEAD_MS);
      try {
        await addReminderJobs(queues.get(QUEUES.messages)!, soon, reminderOptions);
      } catch (err) {
        logger.warn('enqueue deferred to reconciler', { job: JOBS.deliverReminder.name, count: soon.length, err: (err as Error).message });
      }
    },
    close: async () => {
      await Promise.all([...queues.values()].map((q) => q.close()));
    },
  };
}
