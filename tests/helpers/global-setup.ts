import 'reflect-metadata';
import { createDataSource } from '../../server/db/data-source';

// Rebuilds the API test database from nothing with the real migrations (never synchronize).
export default async function setup(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url || !/_test\b/.test(url)) throw new Error(`Refusing to reset a database that is not a test database: ${url}`);
  const ds = createDataSource(url, { applicationName: 'nestflow-test-setup' });
  await ds.initialize();
  await ds.query('DROP SCHEMA IF EXISTS public CASCADE');
  await ds.query('CREATE SCHEMA public');
  await ds.runMigrations({ transaction: 'each' });
  await ds.destroy();
}
