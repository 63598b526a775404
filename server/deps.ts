import { Redis } from 'ioredis';
import pg from 'pg';
import type { DataSource } from 'typeorm';
import type { Env } from './env';
import { createDataSource } from './db/data-source';
import { createAuditRepository } from './db/repositories/audit.repository';
import { createProgrammesRepository } from './db/repositories/programmes.repository';
import { createUsersRepository } from './db/repositories/users.repository';
import { createLogger, type Logger } from './lib/logger';

/** Everything the app needs from the outside world, built once per process and closed in order on shutdown. */
export interface AppDeps {
  env: Env;
  ds: DataSource;
  redis: Redis;
  sessionPool: pg.Pool;
  logger: Logger;
  repos: {
    users: ReturnType<typeof createUsersRepository>;
    audit: ReturnType<typeof createAuditRepository>;
    programmes: ReturnType<typeof createProgrammesRepository>;
  };
}

export async function createDeps(env: Env, name = 'api'): Promise<AppDeps> {
  const ds = createDataSource(env.DATABASE_URL, { applicationName: `nestflow-${name}` });
  await ds.initialize();
  const redis = new Redis(env.REDIS_URL, { maxRetriesPerRequest: 2, enableOfflineQueue: true, lazyConnect: false });
  redis.on('error', () => undefined);
  const sessionPool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 5, application_name: `nestflow-${name}-sessions` });
  sessionPool.on('error', () => undefined);
  return {
    env,
    ds,
    redis,
    sessionPool,
    logger: createLogger(env.NODE_ENV === 'test' ? 'silent' : env.LOG_LEVEL, name),
    repos: {
      users: createUsersRepository(ds),
      audit: createAuditRepository(ds),
      programmes: createProgrammesRepository(ds),
    },
  };
}

export async function closeDeps(deps: AppDeps): Promise<void> {
  await deps.sessionPool.end().catch(() => undefined);
  await deps.ds.destroy().catch(() => undefined);
  deps.redis.disconnect();
}
