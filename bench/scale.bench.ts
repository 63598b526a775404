// docs/service-targets.md: list cost at scale. The caseload of a 20,000-baby and a 200,000-baby programme in one
// database (npm run seed -- --scale 200000, loaded here if missing), timed per request through the real app, the
// app against a bare node:http + pg route running the best SQL for the same page, and the SQL statements each kind
// of request runs (counted, not timed). Prints figures only; never fails on a number.
import 'reflect-metadata';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import pg from 'pg';
import { loadEnv } from '../server/env';
import { closeDeps, createDeps } from '../server/deps';
import { createApp } from '../server/app';
import express from 'express';
import { createSessionMiddleware } from '../server/auth/session-middleware';
import { fork } from 'node:child_process';
import { SCALE_PASSWORD, scaleProgrammes, seedScale } from '../seed/scale';
import { replan } from '../server/modules/schedule/planning';

const ADMIN_URL = process.env.BENCH_ADMIN_URL ?? 'postgres://postgres@127.0.0.1:54329/postgres';
const SCALE_URL = process.env.BENCH_SCALE_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/nestflow_scale';
const N = Number(process.env.BENCH_SCALE ?? 200_000);
const SAMPLES = 300;
const THROUGHPUT_REQUESTS = 1_500;
const CONCURRENCY = 16;

const admin = new pg.Client({ connectionString: ADMIN_URL });
await admin.connect();
if (!(await admin.query(`SELECT 1 FROM pg_database WHERE datname = 'nestflow_scale'`)).rowCount) await admin.query('CREATE DATABASE nestflow_scale');
await admin.end();

// Count every statement sent through node-postgres (the app's pools and the bare route's alike).
let statements = 0;
const originalQuery = pg.Client.prototype.query;
pg.Client.prototype.query = function counted(this: pg.Client, ...args: unknown[]) {
  statements++;
  return (originalQuery as (...a: unknown[]) => unknown).apply(this, args);
} as typeof pg.Client.prototype.query;

const env = loadEnv({ ...process.env, NODE_ENV: 'test', DATABASE_URL: SCALE_URL, QUEUE_PREFIX: 'benchscale', SIGNIN_IP_LIMIT: '100000', LOG_LEVEL: 'silent' });
const deps = await createDeps(env, 'bench');
await deps.ds.runMigrations({ transaction: 'each' });
console.log(`scale data set: ${N.toLocaleString('en')} babies in the largest programme`);
const load = await seedScale(deps, N, (l) => console.log(l));
if (load.babies) console.log(`  loaded in ${load.seconds.toFixed(0)} s`);

const listen = (server: Server) => new Promise<number>((r) => server.listen(0, '127.0.0.1', () => r((server.address() as AddressInfo).port)));
const app = createServer(createApp(deps));
const appPort = await listen(app);
const pool = new pg.Pool({ connectionString: SCALE_URL, max: 10 });

async function signIn(email: string): Promise<string> {
  const first = await fetch(`http://127.0.0.1:${appPort}/api/session`);
  const cookie = first.headers.get('set-cookie')!.split(';')[0]!;
  const { csrfToken } = await first.json();
  const res = await fetch(`http://127.0.0.1:${appPort}/api/session`, { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password: SCALE_PASSWORD }) });
  if (!res.ok) throw new Error(`sign-in ${email}: ${res.status}`);
  const jar = new Map([cookie, ...res.headers.getSetCookie().map((c) => c.split(';')[0]!)].map((c) => [c.slice(0, c.indexOf('=')), c]));
  return [...jar.values()].join('; ');
}

const ms = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e6;
const pct = (v: number[], p: number) => [...v].sort((a, b) => a - b)[Math.min(v.length - 1, Math.floor(v.length * p))]!;

async function timeEach(url: string, headers: Record<string, string>): Promise<{ median: number; p99: number }> {
  const times: number[] = [];
  for (let i = 0; i < SAMPLES + 20; i++) {
    const t = process.hrtime.bigint();
    const res = await fetch(url, { headers });
    if (!res.ok) throw new Error(`${url}: ${res.status}`);
    await res.arrayBuffer();
    if (i >= 20) times.push(ms(t));
  }
  return { median: pct(times, 0.5), p99: pct(times, 0.99) };
}

// Throughput is driven from another process, as real clients are: in this one, the client's own work would be
// charged to whichever server it is measuring. Each answer's CPU cost in this process is reported too.
const loader = fork('bench/lib/load-client.ts', [], { execArgv: ['--import', 'tsx'], stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
const serverCpuMs: Record<string, number[]> = {};
async function throughput(url: string, headers: Record<string, string>): Promise<number> {
  const cpu = process.cpuUsage();
  loader.send({ url, headers, requests: THROUGHPUT_REQUESTS, concurrency: CONCURRENCY });
  const answer = await new Promise<{ perSecond?: number; error?: string }>((r) => loader.once('message', r));
  if (answer.error) throw new Error(answer.error);
  const used = process.cpuUsage(cpu);
  (serverCpuMs[`${url} ${headers['accept-encoding']}`] ??= []).push((used.user + used.system) / 1000 / THROUGHPUT_REQUESTS);
  return answer.perSecond!;
}

/**
 * The cursor 20 pages into a sorted, filtered list: deep enough that an offset would have to skip 475 rows (or the
 * last page's, for a list shorter than that at a small BENCH_SCALE).
 */
async function deepCursor(cookie: string, query: string, path = '/api/infants'): Promise<string> {
  let body = await (await fetch(`http://127.0.0.1:${appPort}${path}?${query}`, { headers: { cookie } })).json();
  let cursor: string | null = null;
  for (let i = 0; i < 20 && body.nextCursor; i++) {
    cursor = body.nextCursor;
    if (i < 19) body = await (await fetch(`http://127.0.0.1:${appPort}${path}?${query}&cursor=${cursor}`, { headers: { cookie } })).json();
  }
  if (!cursor) throw new Error(`${path}?${query}: a single page, nothing to page through`);
  return cursor;
}

const QUERY = 'status=on_oxygen&sort=-elevation&pageSize=25';
const [large, tenth] = scaleProgrammes(N);
const rows: Array<Record<string, string>> = [];
const perSize: Record<string, { first: number; deep: number; firstP99: number; deepP99: number }> = {};
for (const programme of [tenth!, large!]) {
  const cookie = await signIn(`coordinator@${programme.slug}.scale.example`);
  const cursor = await deepCursor(cookie, QUERY);
  const first = await timeEach(`http://127.0.0.1:${appPort}/api/infants?${QUERY}`, { cookie });
  const deep = await timeEach(`http://127.0.0.1:${appPort}/api/infants?${QUERY}&cursor=${cursor}`, { cookie });
  perSize[programme.slug] = { first: first.median, deep: deep.median, firstP99: first.p99, deepP99: deep.p99 };
  rows.push({ programme: `${programme.babies.toLocaleString('en')} babies`, 'first page (median / p99)': `${first.median.toFixed(2)} / ${first.p99.toFixed(2)} ms`, 'page 21 by cursor (median / p99)': `${deep.median.toFixed(2)} / ${deep.p99.toFixed(2)} ms` });
}
console.log(`\ncaseload list (${QUERY}), one request at a time, ${SAMPLES} samples each`);
console.table(rows);
const ratioFirst = perSize[large!.slug]!.first / perSize[tenth!.slug]!.first;
const ratioDeep = perSize[large!.slug]!.deep / perSize[tenth!.slug]!.deep;
console.log(`  ratio ${large!.babies.toLocaleString('en')} / ${tenth!.babies.toLocaleString('en')}: first page ${ratioFirst.toFixed(2)}×, page 21 ${ratioDeep.toFixed(2)}× (target ≤ 1.3×)`);

// The name search of the caseload and the message log (trigram indexes): one baby's family name, and a name no one
// has — without the indexes, both read every baby (or every message) of the programme.
const searchRows: Array<Record<string, string>> = [];
for (const programme of [tenth!, large!]) {
  const cookie = await signIn(`coordinator@${programme.slug}.scale.example`);
  const [{ family_name: oneFamily }] = (await pool.query(
    `SELECT i.family_name FROM infants i JOIN programmes p ON p.id = i.programme_id WHERE p.slug = $1 ORDER BY i.id LIMIT 1`, [programme.slug])).rows;
  for (const [list, path] of [['caseload', '/api/infants'], ['message log', '/api/messages']] as const) {
    for (const [what, q] of [['one baby\'s family name', oneFamily], ['a name no one has', 'Quornwick']] as const) {
      const t = await timeEach(`http://127.0.0.1:${appPort}${path}?q=${encodeURIComponent(q)}&pageSize=25`, { cookie });
      searchRows.push({ programme: `${programme.babies.toLocaleString('en')} babies`, list, search: what, 'median / p99': `${t.median.toFixed(2)} / ${t.p99.toFixed(2)} ms` });
    }
  }
}
console.log(`\nname search, first page, one request at a time, ${SAMPLES} samples each`);
console.table(searchRows);

// The message log and People page the same way (keyset, server/db/repositories/list-paging.ts): a quarter as many
// messages as babies, one nurse per 40 babies.
const OTHER_LISTS = [
  { list: 'message log', path: '/api/messages', query: 'status=sent&sort=-sendAt&pageSize=25' },
  { list: 'message log, by status', path: '/api/messages', query: 'sort=status&pageSize=25' },
  { list: 'People', path: '/api/users', query: 'role=nurse&sort=name&pageSize=10' },
];
const otherRows: Array<Record<string, string>> = [];
for (const { list, path, query } of OTHER_LISTS) {
  const deepBySize: number[] = [];
  for (const programme of [tenth!, large!]) {
    const cookie = await signIn(`${path === '/api/users' ? 'admin' : 'coordinator'}@${programme.slug}.scale.example`);
    const cursor = await deepCursor(cookie, query, path);
    const first = await timeEach(`http://127.0.0.1:${appPort}${path}?${query}`, { cookie });
    const deep = await timeEach(`http://127.0.0.1:${appPort}${path}?${query}&cursor=${cursor}`, { cookie });
    deepBySize.push(deep.median);
    otherRows.push({ list: `${list} (${query})`, programme: `${programme.babies.toLocaleString('en')} babies`,
      'first page (median / p99)': `${first.median.toFixed(2)} / ${first.p99.toFixed(2)} ms`, 'page 21 by cursor (median / p99)': `${deep.median.toFixed(2)} / ${deep.p99.toFixed(2)} ms`,
      'page 21 ratio': programme === large ? `${(deepBySize[1]! / deepBySize[0]!).toFixed(2)}×` : '' });
  }
}
console.log(`\nmessage log and People, one request at a time, ${SAMPLES} samples each (ratio: largest / tenth programme)`);
console.table(otherRows);

// The bare route: the best SQL we can write for the same page — the keyset page with its joins and the capped count
// in one statement, prepared once per connection as the app's is — straight through pg, with no sessions, ability
// checks or validation.
const cookie = await signIn(`coordinator@${large!.slug}.scale.example`);
const [{ id: programmeId }] = (await pool.query(`SELECT id FROM programmes WHERE slug = $1`, [large!.slug])).rows;
const cursor = await deepCursor(cookie, QUERY);
const [, [pressure], afterId] = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as [string, string[], string];
const PAGE_SQL = `SELECT i.id, i.given_name, i.family_name, i.birth_date::text AS birth_date, i.ga_weeks, i.ga_days, i.home_elevation_m, i.home_pressure_mmhg,
    i.status, i.flags, i.nurse_id, i.consultant_id, n.name AS nurse_name, c.name AS consultant_name, p.approved_flow_lpm AS active_flow_lpm
  FROM infants i LEFT JOIN users n ON n.id = i.nurse_id LEFT JOIN users c ON c.id = i.consultant_id
  LEFT JOIN prescriptions p ON p.infant_id = i.id AND p.status = 'active'
  WHERE i.programme_id = $1 AND i.status = 'on_oxygen' AND (i.home_pressure_mmhg, i.id) > ($2::numeric, $3::uuid)
  ORDER BY i.home_pressure_mmhg ASC, i.id ASC LIMIT 26`;
const COUNT_SQL = `SELECT count(*)::int AS n FROM (SELECT 1 FROM infants i WHERE i.programme_id = $1 AND i.status = 'on_oxygen' LIMIT 10001) t`;
const BARE_SQL = `SELECT c.n, page.* FROM (${COUNT_SQL}) c LEFT JOIN (${PAGE_SQL}) page ON true ORDER BY page.home_pressure_mmhg, page.id`;
const bare = createServer(async (_req, res) => {
  const { rows } = await pool.query({ name: 'bare_page', text: BARE_SQL, values: [programmeId, pressure, afterId] });
  res.setHeader('content-type', 'application/json');
  res.end(JSON.stringify({ items: rows[0].id === null ? [] : rows.slice(0, 25), total: rows[0].n }));
});
const barePort = await listen(bare);
const appUrl = `http://127.0.0.1:${appPort}/api/infants?${QUERY}&cursor=${cursor}`;
const bareUrl = `http://127.0.0.1:${barePort}/`;
// Like for like: both answer uncompressed JSON (the bare route has no gzip). The app's gzip, which phones get, is
// measured on its own line: the client decompresses in this same process, so it costs the app twice here.
const PLAIN = { 'accept-encoding': 'identity' };
await throughput(appUrl, { cookie, ...PLAIN });
await throughput(bareUrl, PLAIN);
const appRates: number[] = [];
const bareRates: number[] = [];
const gzipRates: number[] = [];
for (let round = 0; round < 3; round++) {
  bareRates.push(await throughput(bareUrl, PLAIN));
  appRates.push(await throughput(appUrl, { cookie, ...PLAIN }));
  gzipRates.push(await throughput(appUrl, { cookie, 'accept-encoding': 'gzip' }));
}
const appRate = pct(appRates, 0.5);
const bareRate = pct(bareRates, 0.5);
console.log(`\npage 21 of the ${large!.babies.toLocaleString('en')}-baby caseload, ${THROUGHPUT_REQUESTS} requests × 3 rounds, concurrency ${CONCURRENCY}`);
const cpuPerRequest = (url: string) => pct(serverCpuMs[`${url} identity`]!, 0.5).toFixed(2);
console.log(`  bare node:http + pg (best SQL)  median ${bareRate.toFixed(0)} req/s  (${cpuPerRequest(bareUrl)} ms CPU per request in the server process)`);
console.log(`  Nestflow API                    median ${appRate.toFixed(0)} req/s  (${cpuPerRequest(appUrl)} ms CPU per request in the server process)`);
console.log(`  ratio (target ≥ 0.8)            ${(appRate / bareRate).toFixed(2)}×`);
console.log(`  Nestflow API, gzip as phones get it: median ${pct(gzipRates, 0.5).toFixed(0)} req/s (${(pct(gzipRates, 0.5) / bareRate).toFixed(2)}× the bare route)`);

// Where the app's cost per request goes, as a floor: the same page's JSON (already made) answered by Express alone,
// and by Express with the session read every signed-in request does, driven the same way.
const pageJson = await (await fetch(appUrl, { headers: { cookie, ...PLAIN } })).text();
const expressOnly = express();
expressOnly.get('/', (_req, res) => { res.type('json').send(pageJson); });
const withSession = express();
withSession.use(createSessionMiddleware(env, deps.sessionPool));
withSession.get('/', (_req, res) => { res.type('json').send(pageJson); });
const floors: Array<[string, Server]> = [['Express alone, the same JSON', createServer(expressOnly)], ['Express + the session read, the same JSON', createServer(withSession)]];
for (const [label, server] of floors) {
  const url = `http://127.0.0.1:${await listen(server)}/`;
  const rates: number[] = [];
  for (let round = 0; round < 3; round++) rates.push(await throughput(url, { cookie, ...PLAIN }));
  console.log(`  ${label.padEnd(42)} median ${pct(rates, 0.5).toFixed(0)} req/s  (${cpuPerRequest(url)} ms CPU per request in the server process)`);
  server.close();
}

// Open loop: requests are sent at a fixed rate whatever the answers' speed (a closed loop would slow down with the
// server and hide queueing), and the latency of each is kept.
async function openLoop(url: string, headers: Record<string, string>, perSecond: number, seconds: number): Promise<{ p50: number; p99: number; errors: number }> {
  const times: number[] = [];
  let errors = 0;
  const pending: Array<Promise<void>> = [];
  const start = process.hrtime.bigint();
  const total = perSecond * seconds;
  for (let i = 0; i < total; i++) {
    const due = Number(start) / 1e6 + (i * 1000) / perSecond;
    const wait = due - Number(process.hrtime.bigint()) / 1e6;
    if (wait > 0) await new Promise((r) => setTimeout(r, wait));
    const sent = process.hrtime.bigint();
    pending.push(fetch(url, { headers }).then(async (res) => {
      await res.arrayBuffer();
      if (!res.ok) errors++;
      // Measured from when it was due, so a late send counts against the server too.
      times.push(Number(process.hrtime.bigint()) / 1e6 - Math.min(due, Number(sent) / 1e6));
    }, () => { errors++; }));
  }
  await Promise.all(pending);
  return { p50: pct(times, 0.5), p99: pct(times, 0.99), errors };
}
const RATE = Number(process.env.BENCH_RATE ?? 50);
const SECONDS = 20;
const appIdle = await openLoop(appUrl, { cookie }, RATE, SECONDS);
const bareIdle = await openLoop(bareUrl, {}, RATE, SECONDS);
const analyser = fork('bench/lib/analyse-loop.ts', [], { execArgv: ['--import', 'tsx'], stdio: ['ignore', 'pipe', 'inherit', 'ipc'] });
await new Promise((r) => analyser.once('message', r));
const appBusy = await openLoop(appUrl, { cookie }, RATE, SECONDS);
let analysed = '';
analyser.stdout!.on('data', (d) => { analysed += String(d); });
const stopped = new Promise((r) => analyser.once('exit', r));
analyser.kill('SIGTERM');
await stopped;
console.log(`\nopen loop, ${RATE} requests/s for ${SECONDS} s (latency from when each request was due)`);
console.table([
  { route: 'bare node:http + pg', 'p50 ms': bareIdle.p50.toFixed(1), 'p99 ms': bareIdle.p99.toFixed(1), errors: bareIdle.errors },
  { route: 'Nestflow API, idle', 'p50 ms': appIdle.p50.toFixed(1), 'p99 ms': appIdle.p99.toFixed(1), errors: appIdle.errors },
  { route: `Nestflow API, 24 h recordings analysed meanwhile (${analysed.trim() || '?'} finished)`, 'p50 ms': appBusy.p50.toFixed(1), 'p99 ms': appBusy.p99.toFixed(1), errors: appBusy.errors },
]);

// Re-planning every baby's checks, as the daily job and a policy change do: wall time at N/10 and N babies.
const planTimes: Array<{ babies: string; seconds: string; 'ms per baby': string }> = [];
for (const programme of [tenth!, large!]) {
  const [{ id }] = (await pool.query(`SELECT id FROM programmes WHERE slug = $1`, [programme.slug])).rows;
  const t = process.hrtime.bigint();
  const { planned } = await replan(deps.repos, { programmeId: id }, new Date('2026-12-01T06:00:00Z'));
  const took = ms(t);
  planTimes.push({ babies: planned.toLocaleString('en'), seconds: (took / 1000).toFixed(1), 'ms per baby': (took / planned).toFixed(3) });
}
console.log('\nre-planning all checks of a programme');
console.table(planTimes);

// Statements per request, counted at the driver.
async function countStatements(method: string, url: string, body?: unknown, csrf?: string): Promise<number> {
  const before = statements;
  const res = await fetch(`http://127.0.0.1:${appPort}${url}`, {
    method, headers: { cookie, ...(body ? { 'content-type': 'application/json', 'x-csrf-token': csrf! } : {}) }, body: body ? JSON.stringify(body) : undefined,
  });
  if (!res.ok) throw new Error(`${method} ${url}: ${res.status} ${await res.text()}`);
  await res.arrayBuffer();
  // Session touches are written after the response; give them a moment to be counted with their request.
  await new Promise((r) => setTimeout(r, 50));
  return statements - before;
}
const session = await (await fetch(`http://127.0.0.1:${appPort}/api/session`, { headers: { cookie } })).json();
const babyId = (await pool.query(`SELECT id FROM infants WHERE programme_id = $1 ORDER BY id LIMIT 1`, [programmeId])).rows[0].id;
const nurseCookie = cookie;
console.log('\nSQL statements per request (counted at the driver, including session reads and writes)');
console.table([
  { request: 'caseload list, page 21', statements: await countStatements('GET', `/api/infants?${QUERY}&cursor=${cursor}`) },
  { request: 'caseload list, first page, name search', statements: await countStatements('GET', '/api/infants?q=Ashcombe&pageSize=25') },
  { request: 'message log, page 21', statements: await countStatements('GET', `/api/messages?${OTHER_LISTS[0]!.query}&cursor=${await deepCursor(cookie, OTHER_LISTS[0]!.query, '/api/messages')}`) },
  { request: 'baby record', statements: await countStatements('GET', `/api/infants/${babyId}`) },
  { request: "baby's readings", statements: await countStatements('GET', `/api/infants/${babyId}/readings`) },
  { request: 'log a reading (write)', statements: await countStatements('POST', `/api/infants/${babyId}/readings`, { takenAt: '2026-11-30T10:00:00Z', spo2: 95, state: 'awake' }, session.csrfToken) },
]);
void nurseCookie;

loader.kill();
app.close();
bare.close();
await pool.end();
await closeDeps(deps);
process.exit(0);
