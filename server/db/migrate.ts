import { loadEnv } from '../env';
import { createDataSource } from './data-source';

// Explicit migration step for `npm start`, `npm test` and deployments; the app never migrates on its own.
const env = loadEnv();
const ds = createDataSource(env.DATABASE_URL, { applicationName: 'nestflow-migrate' });
await ds.initialize();
try {
  const applied = await ds.runMigrations({ transaction: 'each' });
  console.log(applied.length ? `Applied ${applied.map((m) => m.name).join(', ')}` : 'Database schema is up to date');
} finally {
  await ds.destroy();
}
