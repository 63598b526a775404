import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { ENTITIES } from './entities/index-list';
import { MIGRATIONS } from './migrations/index-list';
import { SafeQueryLogger } from './query-logger';

export function createDataSource(url: string, options: { poolSize?: number; applicationName?: string; quiet?: boolean } = {}) {
  return new DataSource({
    type: 'postgres',
    url,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    synchronize: false,
    migrationsRun: false,
    logging: ['error', 'warn'],
    logger: new SafeQueryLogger(options.quiet ?? false),
    poolSize: options.poolSize ?? 10,
    applicationName: options.applicationName ?? 'nestflow',
  });
}
