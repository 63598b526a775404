import { Queue, QueueEvents, Worker, type Processor } from 'bullmq';
import { QUEUES } from '@shared/jobs/catalogue';
import { redisConnection } from '../../worker/queues';
import type { TestContext } from './test-app';

export interface ClinicalQueue {
  worker: Worker;
  /** What a test waits on: `job.waitUntilFinished(events, …)`. */
  events: QueueEvents;
  /** What a test looks jobs up and counts them on. */
  queue: Queue;
  close(): Promise<void>;
}

/**
 * A worker on the real clinical queue under the test run's own prefix, with the events and queue handles a test
 * needs; ready once it returns, so no job finishes before anyone listens for it.
 */
export async function startClinicalQueue(ctx: TestContext, processor: Processor): Promise<ClinicalQueue> {
  const connection = redisConnection(ctx.deps.env.REDIS_URL);
  const prefix = ctx.deps.env.QUEUE_PREFIX;
  const worker = new Worker(QUEUES.clinical, processor, { connection, prefix });
  const events = new QueueEvents(QUEUES.clinical, { connection, prefix });
  const queue = new Queue(QUEUES.clinical, { connection, prefix });
  await events.waitUntilReady();
  return {
    worker,
    events,
    queue,
    close: async () => {
      await worker.close();
      await events.close();
      await queue.close();
    },
  };
}
