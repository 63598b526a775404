import 'reflect-metadata';
import { Queue, UnrecoverableError, Worker } from 'bullmq';
import { loadEnv } from '../server/env';
import { createDataSource } from '../server/db/data-source';
import { createRepos } from '../server/deps';
import { createJobProducer } from '../server/jobs/producer';
import { Redis } from 'ioredis';
import { createLogger, logEvery } from '../server/lib/logger';
import { beat, HEARTBEAT_EVERY_MS, stopBeating, workerId } from '../server/lib/heartbeat';
import { JOBS, QUEUES } from '@shared/jobs/catalogue';
import { redisConnection } from './queues';
import { pruneSessions } from './processors/prune-sessions.processor';
import { convertPrescriptionProcessor } from './processors/convert-prescription.processor';
import { reconcileConversions } from './processors/reconcile-conversions.processor';
import { analyseRecordingProcessor, reanalyseOutdated, reconcileRecordings } from './processors/analyse-recording.processor';
import { planningProcessor } from './processors/planning.processor';
import { replan } from '../server/modules/schedule/planning';
import { upsertSchedules } from './schedules';
import { deliverReminderProcessor } from './processors/deliver-reminder.processor';
import { createDelivery } from '../server/modules/reminders/delivery';
import { reconcileReminders } from '../server/modules/reminders/reconcile';
import { planDigests } from '../server/modules/reminders/digests';
import { addReminderJobs } from '../server/jobs/reminder-jobs';
import { createMailSender } from '../server/notifications/mail-sender';
import { createSmsSender } from '../server/notifications/sms-sender';
import { createMailSearch } from '../server/notifications/mail-search';
import { createAuditChainService } from '../server/modules/audit/chain.service';
import { createAuditChainMail } from '../server/notifications/audit-chain-mail';

const env = loadEnv();
const logger = createLogger(env.LOG_LEVEL, 'worker');
const ds = createDataSource(env.DATABASE_URL, { applicationName: 'nestflow-worker', poolSize: 5 });
await ds.initialize();
const repos = createRepos(ds);
const jobs = createJobProducer(env.REDIS_URL, env.QUEUE_PREFIX, logger);
const connection = redisConnection(env.REDIS_URL);
const prefix = env.QUEUE_PREFIX;

const maintenanceQueue = new Queue(QUEUES.maintenance, { connection, prefix });
const messagesQueue = new Queue(QUEUES.messages, { connection, prefix });
const reminderJobs = { attempts: env.REMINDER_ATTEMPTS, backoffMs: env.REMINDER_BACKOFF_MS };
const scheduleOptions = { reconcileRemindersMs: env.REMINDER_RECONCILE_MS };
await upsertSchedules(maintenanceQueue, scheduleOptions);
// A Redis that comes back empty has lost the schedules too; upserting again on every reconnect restores them.
(await maintenanceQueue.getBackend().client).on('ready', () => {
  upsertSchedules(maintenanceQueue, scheduleOptions).catch((err) => logger.warn('schedules not restored yet', { err: (err as Error).message }));
});
const mail = createMailSender(env, { timeoutMs: env.SEND_TIMEOUT_MS });
const sms = createSmsSender(env, { timeoutMs: env.SEND_TIMEOUT_MS });
const mailSearch = createMailSearch(env.MAIL_SEARCH_URL, { timeoutMs: env.SEND_TIMEOUT_MS });
if (!mailSearch) logger.warn('no mail search configured: an e-mail attempt of unknown outcome will wait for a coordinator');
const delivery = createDelivery({ ds, repos, mail, sms, mailSearch, logger, enqueue: (rows) => addReminderJobs(messagesQueue, rows, reminderJobs),
  // Three sender time-outs: an attempt older than that cannot still be waiting on the provider.
  inFlightGuardMs: 3 * env.SEND_TIMEOUT_MS });
// Pick up anything left 'preparing' while no worker was running.
await reconcileConversions(repos, jobs, 0);
await reconcileRecordings(repos, jobs, 0, 0);
// Schedules move on with time (the plan looks a fixed number of weeks ahead), so start from a fresh plan.
await replan(repos, {});
await repos.checks.markOverdue();
await planDigests(ds, repos);
await reconcileReminders(repos, messagesQueue, reminderJobs);

const auditChain = createAuditChainService(repos, logger, () => new Date(), { mail: createAuditChainMail(mail) });

const maintenance = new Worker(
  QUEUES.maintenance,
  async (job) => {
    if (job.name === JOBS.pruneSessions.name) return pruneSessions(repos);
    if (job.name === JOBS.markOverdue.name) return { replanned: await replan(repos, {}), overdue: await repos.checks.markOverdue() };
    if (job.name === JOBS.reconcileReminders.name) return { enqueued: await reconcileReminders(repos, messagesQueue, reminderJobs) };
    if (job.name === JOBS.reanalyseRecordings.name) return reanalyseOutdated(ds, repos);
    if (job.name === JOBS.planDigests.name) return { planned: (await planDigests(ds, repos)).length };
    if (job.name === JOBS.verifyAuditChain.name) return auditChain.verifyAll();
    if (job.name === JOBS.reconcileConversions.name) {
      return { conversions: await reconcileConversions(repos, jobs), recordings: await reconcileRecordings(repos, jobs) };
    }
    throw new UnrecoverableError(`Unknown maintenance job ${job.name}`);
  },
  { connection, prefix, concurrency: 1 },
);
const clinical = new Worker(
  QUEUES.clinical,
  async (job) => {
    if (job.name === JOBS.convertPrescription.name) return convertPrescriptionProcessor(job, ds, repos);
    if (job.name === JOBS.analyseRecording.name) return analyseRecordingProcessor(job, ds, repos, jobs);
    throw new UnrecoverableError(`Unknown clinical job ${job.name}`);
  },
  { connection, prefix, concurrency: 4 },
);
const planning = new Worker(QUEUES.planning, (job) => planningProcessor(job, repos), { connection, prefix, concurrency: 1 });
// A short lock lets another worker take over a crashed one's messages quickly; the ledger guards against doubles.
const messages = new Worker(QUEUES.messages, (job) => deliverReminderProcessor(job, delivery), {
  connection, prefix, concurrency: env.REMINDER_CONCURRENCY, lockDuration: 15_000, stalledInterval: 5_000, maxStalledCount: 10,
});
for (const [name, w] of [[QUEUES.maintenance, maintenance], [QUEUES.clinical, clinical], [QUEUES.planning, planning], [QUEUES.messages, messages]] as const) {
  w.on('failed', (job, err) => logger.warn('job failed', { queue: name, job: job?.name, jobId: job?.id, attempts: job?.attemptsMade, err: err.message }));
  // Without an 'error' listener a lost Redis connection inside a BullMQ worker is an unhandled error event.
  w.on('error', logEvery(60_000, (err: Error) => logger.error('worker queue error', { queue: name, err: err.message })));
}
for (const q of [maintenanceQueue, messagesQueue]) q.on('error', logEvery(60_000, (err: Error) => logger.warn('queue connection error', { queue: q.name, err: err.message })));

// The heartbeat the API's readiness check shows: a worker silent for over a minute is reported missing.
const heartbeatRedis = new Redis(env.REDIS_URL, { maxRetriesPerRequest: 1 });
heartbeatRedis.on('error', logEvery(60_000, (err: Error) => logger.warn('heartbeat connection error', { err: err.message })));
const me = workerId();
const sendBeat = () => beat(heartbeatRedis, prefix, me, new Date()).catch((err) => logger.warn('heartbeat not written', { err: (err as Error).message }));
await sendBeat();
const heartbeatTimer = setInterval(sendBeat, HEARTBEAT_EVERY_MS);
logger.info('worker started', { queues: Object.values(QUEUES), workerId: me });

let closing = false;
async function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  logger.info('worker shutting down', { signal });
  clearInterval(heartbeatTimer);
  await stopBeating(heartbeatRedis, prefix, me).catch(() => undefined);
  heartbeatRedis.disconnect();
  // Let active jobs finish before the connections go.
  await Promise.all([maintenance.close(), clinical.close(), planning.close(), messages.close()]);
  await Promise.all([maintenanceQueue.close(), messagesQueue.close()]);
  mail.close();
  await jobs.close();
  await ds.destroy();
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
