// docs/service-targets.md P9: the caseload and message-log CSV exports of the scale data set (npm run seed -- --scale
// N, loaded here if missing) through the real app: time, rows, bytes, and how far the API's heap rises while a file
// streams, for the N-baby programme beside the N/10 one (a streamed export's memory does not grow with its rows).
// The client reads the body as a stream and keeps only counts. Prints figures only; never fails on a number.
// scripts/bench.sh runs it with --expose-gc.
import 'reflect-metadata';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import pg from 'pg';
import { loadEnv } from '../server/env';
import { closeDeps, createDeps } from '../server/deps';
import { createApp } from '../server/app';
import { SCALE_PASSWORD, seedScale } from '../seed/scale';

const ADMIN_URL = process.env.BENCH_ADMIN_URL ?? 'postgres://postgres@127.0.0.1:54329/postgres';
const SCALE_URL = process.env.BENCH_SCALE_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/nestflow_scale';
const N = Number(process.env.BENCH_SCALE ?? 200_000);

const admin = new pg.Client({ connectionString: ADMIN_URL });
await admin.connect();
if (!(await admin.query(`SELECT 1 FROM pg_database WHERE datname = 'nestflow_scale'`)).rowCount) await admin.query('CREATE DATABASE nestflow_scale');
await admin.end();

const env = loadEnv({ ...process.env, NODE_ENV: 'test', DATABASE_URL: SCALE_URL, QUEUE_PREFIX: 'benchcsv', SIGNIN_IP_LIMIT: '100000', LOG_LEVEL: 'silent' });
const deps = await createDeps(env, 'bench');
await deps.ds.runMigrations({ transaction: 'each' });
console.log(`CSV exports (P9): scale data set with ${N.toLocaleString('en')} babies in the largest programme`);
await seedScale(deps, N, (l) => console.log(l));

const app = createServer(createApp(deps));
const port = await new Promise<number>((r) => app.listen(0, '127.0.0.1', () => r((app.address() as AddressInfo).port)));

async function signIn(email: string): Promise<string> {
  const first = await fetch(`http://127.0.0.1:${port}/api/session`);
  const cookie = first.headers.get('set-cookie')!.split(';')[0]!;
  const { csrfToken } = await first.json();
  const res = await fetch(`http://127.0.0.1:${port}/api/session`, { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password: SCALE_PASSWORD }) });
  if (!res.ok) throw new Error(`sign-in ${email}: ${res.status}`);
  const jar = new Map([cookie, ...res.headers.getSetCookie().map((c) => c.split(';')[0]!)].map((c) => [c.slice(0, c.indexOf('=')), c]));
  return [...jar.values()].join('; ');
}

const MiB = 1024 * 1024;
async function measure(label: string, path: string, session: string) {
  // With --expose-gc each sample collects first, so the figure is what the export keeps alive, not garbage V8 has
  // not yet swept; without it the figure includes that garbage.
  const live = () => {
    global.gc?.();
    return process.memoryUsage().heapUsed;
  };
  const before = live();
  let peak = before;
  const sampler = setInterval(() => { peak = Math.max(peak, live()); }, 250);
  const started = process.hrtime.bigint();
  const res = await fetch(`http://127.0.0.1:${port}${path}`, { headers: { cookie: session, 'accept-encoding': 'identity' } });
  if (!res.ok || !res.body) throw new Error(`${path} answered ${res.status}`);
  let bytes = 0;
  let lines = 0;
  for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
    bytes += chunk.length;
    for (const b of chunk) if (b === 10) lines++;
  }
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  clearInterval(sampler);
  console.log(`  ${label.padEnd(34)} ${(lines - 1).toLocaleString('en').padStart(9)} rows  ${(bytes / MiB).toFixed(1).padStart(6)} MiB  ${seconds.toFixed(1).padStart(5)} s  heap rise ${((peak - before) / MiB).toFixed(1)} MiB`);
}

for (const slug of ['scale-tenth', 'scale-large']) {
  const session = await signIn(`coordinator@${slug}.scale.example`);
  await measure(`${slug}: caseload`, '/api/infants.csv?sort=-elevation', session);
  await measure(`${slug}: message log`, '/api/messages.csv', session);
}
console.log(`  (heap rise: the API and this client share one process; ${global.gc ? 'live heap, collected before each sample' : 'run with node --expose-gc to count live objects only'})`);
app.close();
await closeDeps(deps);
process.exit(0);
