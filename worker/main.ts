import 'reflect-metadata';
import { Queue, UnrecoverableError, Worker } from 'bullmq';
import { loadEnv } from '../server/env';
import { createDataSource } from '../server/db/data-source';
import { createLogger } from '../server/lib/logger';
import { JOBS, QUEUES } from '../shared/jobs/catalogue';
import { redisConnection } from './queues';
import { pruneSessions } from './processors/prune-sessions.processor';
import { upsertSchedules } from './schedules';

const env = loadEnv();
const logger = createLogger(env.LOG_LEVEL, 'worker');
const ds = createDataSource(env.DATABASE_URL, { applicationName: 'nestflow-worker', poolSize: 5 });
await ds.initialize();
const connection = redisConnection(env.REDIS_URL);
const prefix = env.QUEUE_PREFIX;

const maintenanceQueue = new Queue(QUEUES.maintenance, { connection, prefix });
await upsertSchedules(maintenanceQueue);

const maintenance = new Worker(
  QUEUES.maintenance,
  async (job) => {
    if (job.name === JOBS.pruneSessions.name) {
      JOBS.pruneSessions.payload.parse(job.data);
      return pruneSessions(ds);
    }
    throw new UnrecoverableError(`Unknown maintenance job ${job.name}`);
  },
  { connection, prefix, concurrency: 1 },
);
maintenance.on('failed', (job, err) => logger.warn('job failed', { queue: QUEUES.maintenance, job: job?.name, err: err.message }));
logger.info('worker started', { queues: Object.values(QUEUES) });

let closing = false;
async function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  logger.info('worker shutting down', { signal });
  // Let active jobs finish before the connections go.
  await maintenance.close();
  await maintenanceQueue.close();
  await ds.destroy();
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
