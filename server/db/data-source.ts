import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { ENTITIES } from './entities/index-list';
import { MIGRATIONS } from './migrations/index-list';

export function createDataSource(url: string, options: { poolSize?: number; applicationName?: string } = {}) {
  return new DataSource({
    type: 'postgres',
    url,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    synchronize: false,
    migrationsRun: false,
    logging: ['error'],
    poolSize: options.poolSize ?? 10,
    applicationName: options.applicationName ?? 'nestflow',
  });
}
