import type { Clock } from './lib/clock';
import { Redis } from 'ioredis';
import pg from 'pg';
import type { DataSource } from 'typeorm';
import type { Env } from './env';
import { createDataSource } from './db/data-source';
import { createAuditRepository } from './db/repositories/audit.repository';
import { createAuditChainRepository } from './db/repositories/audit-chain.repository';
import { createProgrammesRepository } from './db/repositories/programmes.repository';
import { createUsersRepository } from './db/repositories/users.repository';
import { createSitesRepository } from './db/repositories/sites.repository';
import { createPoliciesRepository } from './db/repositories/policies.repository';
import { createInfantsRepository } from './db/repositories/infants.repository';
import { createContactsRepository } from './db/repositories/contacts.repository';
import { createColumnMappingsRepository } from './db/repositories/column-mappings.repository';
import { createPrescriptionsRepository } from './db/repositories/prescriptions.repository';
import { createJobProducer, type JobProducer } from './jobs/producer';
import { createChecksRepository } from './db/repositories/checks.repository';
import { createReadingsRepository } from './db/repositories/readings.repository';
import { createVisitsRepository } from './db/repositories/visits.repository';
import { createRecordingsRepository } from './db/repositories/recordings.repository';
import { createRemindersRepository } from './db/repositories/reminders.repository';
import { createReminderContentRepository } from './db/repositories/reminder-content.repository';
import { createJourneysRepository } from './db/repositories/journeys.repository';
import { createAccountTokensRepository } from './db/repositories/account-tokens.repository';
import { createOverviewRepository } from './db/repositories/overview.repository';
import { createDischargesRepository } from './db/repositories/discharges.repository';
import { createEquipmentOrdersRepository } from './db/repositories/equipment-orders.repository';
import { createMailSender, type MailSender } from './notifications/mail-sender';
import { createLogger, logEvery, type Logger } from './lib/logger';

/** Everything the app needs from the outside world, built once per process and closed in order on shutdown. */
export interface AppDeps {
  env: Env;
  ds: DataSource;
  redis: Redis;
  sessionPool: pg.Pool;
  logger: Logger;
  repos: AppRepos;
  jobs: JobProducer;
  /** Time source for rules that depend on "now" (step-down checks); tests pass a fixed one. */
  clock?: Clock;
  /** E-mail the API sends itself (set-up links, account notices); everything else goes through the worker. */
  mail: MailSender;
  /** The clock for account links and limits; tests give a fixed one. */
  now?: () => Date;
}

export function createRepos(ds: DataSource) {
  return {
    users: createUsersRepository(ds),
    audit: createAuditRepository(ds),
    auditChain: createAuditChainRepository(ds),
    programmes: createProgrammesRepository(ds),
    sites: createSitesRepository(ds),
    policies: createPoliciesRepository(ds),
    infants: createInfantsRepository(ds),
    contacts: createContactsRepository(ds),
    prescriptions: createPrescriptionsRepository(ds),
    checks: createChecksRepository(ds),
    readings: createReadingsRepository(ds),
    visits: createVisitsRepository(ds),
    recordings: createRecordingsRepository(ds),
    columnMappings: createColumnMappingsRepository(ds),
    journeys: createJourneysRepository(ds),
    reminders: createRemindersRepository(ds),
    reminderContent: createReminderContentRepository(ds),
    accountTokens: createAccountTokensRepository(ds),
    overview: createOverviewRepository(ds),
    discharges: createDischargesRepository(ds),
    equipmentOrders: createEquipmentOrdersRepository(ds),
  };
}
export type AppRepos = ReturnType<typeof createRepos>;

export async function createDeps(env: Env, name = 'api'): Promise<AppDeps> {
  const ds = createDataSource(env.DATABASE_URL, { applicationName: `nestflow-${name}`, quiet: env.NODE_ENV === 'test' });
  await ds.initialize();
  const redis = new Redis(env.REDIS_URL, { maxRetriesPerRequest: 2, enableOfflineQueue: true, lazyConnect: false });
  const logger = createLogger(env.NODE_ENV === 'test' ? 'silent' : env.LOG_LEVEL, name);
  // Connection errors are logged (at most once a minute while they last), never swallowed; requests meanwhile get 503.
  redis.on('error', logEvery(60_000, (err: Error) => logger.warn('redis connection error', { err: err.message })));
  const sessionPool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 5, application_name: `nestflow-${name}-sessions` });
  sessionPool.on('error', logEvery(60_000, (err: Error) => logger.warn('session database connection error', { err: err.message })));
  const mail = createMailSender(env, { timeoutMs: env.SEND_TIMEOUT_MS });
  return { env, ds, redis, sessionPool, logger, mail, repos: createRepos(ds), jobs: createJobProducer(env.REDIS_URL, env.QUEUE_PREFIX, logger, { attempts: env.REMINDER_ATTEMPTS, backoffMs: env.REMINDER_BACKOFF_MS }) };
}

export async function closeDeps(deps: AppDeps): Promise<void> {
  await deps.jobs.close().catch(() => undefined);
  deps.mail.close();
  await deps.sessionPool.end().catch(() => undefined);
  await deps.ds.destroy().catch(() => undefined);
  deps.redis.disconnect();
}
