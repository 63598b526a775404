import 'reflect-metadata';
import { loadEnv } from '../server/env';
import { closeDeps, createDeps } from '../server/deps';
import { seedDemo } from './demo';

const env = loadEnv();
if (env.NODE_ENV === 'production') {
  console.error('The demo seed never runs in production (NODE_ENV=production).');
  process.exit(1);
}
const deps = await createDeps(env, 'seed');
const scaleAt = process.argv.indexOf('--scale');
if (scaleAt !== -1) {
  // The scale data set for the benchmarks instead of the demo: npm run seed -- --scale 200000
  const n = Number(process.argv[scaleAt + 1]);
  if (!Number.isInteger(n) || n < 1000 || n > 5_000_000) {
    console.error('--scale needs a whole number of babies between 1,000 and 5,000,000, e.g. --scale 200000');
    process.exit(1);
  }
  try {
    const { seedScale } = await import('./scale');
    const out = await seedScale(deps, n);
    console.log(`Scale data set ready: ${out.programmes} programme(s) and ${out.babies.toLocaleString('en')} babies added in ${out.seconds.toFixed(1)} s.`);
  } finally {
    await closeDeps(deps);
  }
  process.exit(0);
}
try {
  const { people, babies, studies, visits, journeys, history, waiting, discharges, orders } = await seedDemo(deps);
  console.log(`Demo scenario ready (added ${people.programmes} programme(s), ${people.people} person(s), ${babies} baby/babies, ${studies} overnight study/studies, ${visits} visit(s), ${journeys} journey check(s), ${history} former baby/babies, ${waiting} waiting item(s), ${discharges} baby/babies at a discharge stage, ${orders} equipment order(s)).`);
} finally {
  await closeDeps(deps);
}
