import { Queue, type JobsOptions } from 'bullmq';
import { JOBS, QUEUES, conversionJobId, planDedupId, recordingJobId, replanJobId, type JobKey, type JobPayload } from '../../shared/jobs/catalogue';
import type { Logger } from '../lib/logger';

export interface JobProducer {
  enqueueConversion(prescriptionId: string): Promise<void>;
  enqueuePlanInfant(infantId: string): Promise<void>;
  enqueueReplanProgramme(programmeId: string, policyVersion: number): Promise<void>;
  enqueueAnalysis(recordingId: string): Promise<void>;
  close(): Promise<void>;
}

const JOB_OPTIONS = { attempts: 5, backoff: { type: 'exponential', delay: 2000 }, removeOnComplete: 1000, removeOnFail: 5000 } as const;

/**
 * Enqueues after the database commit. If Redis is away the row stays pending in PostgreSQL and the worker's
 * reconciler enqueues it later, so a failed enqueue is logged, never surfaced as a failed request.
 */
export function createJobProducer(redisUrl: string, prefix: string, logger: Logger): JobProducer {
  const u = new URL(redisUrl);
  const connection = {
    host: u.hostname, port: Number(u.port || 6379), db: u.pathname.length > 1 ? Number(u.pathname.slice(1)) : 0,
    enableOfflineQueue: false, maxRetriesPerRequest: 1,
  };
  const queues = new Map(Object.values(QUEUES).map((name) => [name, new Queue(name, { prefix, connection })]));
  for (const q of queues.values()) q.on('error', () => undefined);

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
    close: async () => {
      await Promise.all([...queues.values()].map((q) => q.close()));
    },
  };
}
