import { Queue } from 'bullmq';
import { JOBS, QUEUES, conversionJobId } from '../../shared/jobs/catalogue';
import type { Logger } from '../lib/logger';

export interface JobProducer {
  enqueueConversion(prescriptionId: string): Promise<void>;
  close(): Promise<void>;
}

const JOB_OPTIONS = { attempts: 5, backoff: { type: 'exponential', delay: 2000 }, removeOnComplete: 1000, removeOnFail: 5000 } as const;

/**
 * Enqueues after the database commit. If Redis is away the row stays 'preparing' in PostgreSQL and the worker's
 * reconciler enqueues it later, so a failed enqueue is logged, never surfaced as a failed enrolment.
 */
export function createJobProducer(redisUrl: string, prefix: string, logger: Logger): JobProducer {
  const u = new URL(redisUrl);
  const clinical = new Queue(QUEUES.clinical, {
    prefix,
    connection: { host: u.hostname, port: Number(u.port || 6379), db: u.pathname.length > 1 ? Number(u.pathname.slice(1)) : 0, enableOfflineQueue: false, maxRetriesPerRequest: 1 },
  });
  clinical.on('error', () => undefined);
  return {
    async enqueueConversion(prescriptionId) {
      try {
        const payload = JOBS.convertPrescription.payload.parse({ prescriptionId });
        await clinical.add(JOBS.convertPrescription.name, payload, { ...JOB_OPTIONS, jobId: conversionJobId(prescriptionId) });
      } catch (err) {
        logger.warn('conversion enqueue deferred to reconciler', { err: (err as Error).message });
      }
    },
    close: () => clinical.close(),
  };
}
