// docs/service-targets.md P1: caseload list throughput (25 rows, filtered, sorted, paged, 20k babies) through the real app,
// against a bare node:http + pg route running the same SQL, alternating A B A B in one run. Prints figures only.
import 'reflect-metadata';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import pg from 'pg';
import { loadEnv } from '../server/env';
import { closeDeps, createDeps } from '../server/deps';
import { createApp } from '../server/app';
import { hashPassword } from '../server/auth/passwords';

const ADMIN_URL = process.env.BENCH_ADMIN_URL ?? 'postgres://postgres@127.0.0.1:54329/postgres';
const BENCH_URL = process.env.BENCH_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/nestflow_bench';
const BABIES = 20_000;
const REQUESTS = 1_500;
const CONCURRENCY = 16;
const PASSWORD = 'bench-only-password';

async function prepareDatabase() {
  const admin = new pg.Client({ connectionString: ADMIN_URL });
  await admin.connect();
  const exists = await admin.query(`SELECT 1 FROM pg_database WHERE datname = 'nestflow_bench'`);
  if (!exists.rowCount) await admin.query('CREATE DATABASE nestflow_bench');
  await admin.end();
}

async function seedBabies(db: pg.Pool): Promise<{ email: string; programmeId: string }> {
  const email = 'coordinator@bench.example';
  const have = await db.query(`SELECT programme_id FROM users WHERE email = $1`, [email]);
  if (have.rowCount) return { email, programmeId: have.rows[0].programme_id };
  const hash = await hashPassword(PASSWORD);
  const p = (await db.query(`INSERT INTO programmes (slug, name, time_zone) VALUES ('bench', 'Benchmark programme', 'Europe/London') RETURNING id`)).rows[0].id;
  const ids = (await db.query(
    `INSERT INTO users (programme_id, email, name, role, password_hash) VALUES ($1, $2, 'Bench Coordinator', 'coordinator', $3), ($1, 'nurse@bench.example', 'Bench Nurse', 'nurse', $3), ($1, 'consultant@bench.example', 'Bench Consultant', 'consultant', $3) RETURNING id, role`,
    [p, email, hash],
  )).rows;
  const nurse = ids.find((r) => r.role === 'nurse').id;
  const consultant = ids.find((r) => r.role === 'consultant').id;
  const site = (await db.query(`INSERT INTO sites (programme_id, name, elevation_m) VALUES ($1, 'Bench hospital', 95) RETURNING id`, [p])).rows[0].id;
  await db.query(
    `INSERT INTO infants (programme_id, enrol_key, given_name, family_name, sex, birth_date, ga_weeks, ga_days, term_date, birth_weight_g, weight_kg, weight_date,
       site_id, hospital_flow_lpm, hospital_o2_percent, hospital_source, home_source, home_o2_percent, home_address, home_location, home_elevation_m,
       home_pressure_mmhg, nurse_id, consultant_id, status)
     SELECT $1, gen_random_uuid(), 'Baby', 'Bench ' || g, 'female', current_date - (g % 200), 24 + g % 12, g % 7, current_date - (g % 200) + 80, 900 + g % 900,
       2 + (g % 40) / 10.0, current_date, $2, 0.25, 100, 'cylinder', 'concentrator', 95, g || ' Bench Road', jsonb_build_object('elevationM', g % 2400), g % 2400,
       760 - (g % 2400) / 12.0, $3, $4, (ARRAY['on_oxygen','awaiting_signoff','stepping_down','off_oxygen'])[1 + g % 4]
       FROM generate_series(1, $5) g`,
    [p, site, nurse, consultant, BABIES],
  );
  return { email, programmeId: p };
}

const LIST_SQL = `SELECT i.id, i.given_name, i.family_name, i.birth_date::text AS birth_date, i.ga_weeks, i.ga_days, i.home_elevation_m,
    i.home_pressure_mmhg, i.status, i.flags, i.nurse_id, i.consultant_id, count(*) OVER() AS total,
    n.name AS nurse_name, c.name AS consultant_name, p.approved_flow_lpm AS active_flow_lpm
  FROM infants i LEFT JOIN users n ON n.id = i.nurse_id LEFT JOIN users c ON c.id = i.consultant_id
  LEFT JOIN prescriptions p ON p.infant_id = i.id AND p.status = 'active'
  WHERE i.programme_id = $1 AND i.status = 'on_oxygen'
  ORDER BY i.home_pressure_mmhg ASC, i.id ASC OFFSET 50 LIMIT 25`;

async function load(url: string, headers: Record<string, string>): Promise<number> {
  let next = 0;
  const started = process.hrtime.bigint();
  await Promise.all(Array.from({ length: CONCURRENCY }, async () => {
    while (next < REQUESTS) {
      next++;
      const res = await fetch(url, { headers });
      if (!res.ok) throw new Error(`${url} answered ${res.status}`);
      await res.arrayBuffer();
    }
  }));
  return REQUESTS / (Number(process.hrtime.bigint() - started) / 1e9);
}

const listen = (server: Server) => new Promise<number>((r) => server.listen(0, '127.0.0.1', () => r((server.address() as AddressInfo).port)));
const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];

await prepareDatabase();
const env = loadEnv({ ...process.env, NODE_ENV: 'test', DATABASE_URL: BENCH_URL, QUEUE_PREFIX: 'bench', SIGNIN_IP_LIMIT: '1000' });
const deps = await createDeps(env, 'bench');
await deps.ds.runMigrations({ transaction: 'each' });
const pool = new pg.Pool({ connectionString: BENCH_URL, max: 10 });
const { email, programmeId } = await seedBabies(pool);

const app = createServer(createApp(deps));
const appPort = await listen(app);
const bare = createServer(async (_req, res) => {
  const rows = (await pool.query(LIST_SQL, [programmeId])).rows;
  res.setHeader('content-type', 'application/json');
  res.end(JSON.stringify({ items: rows, total: rows.length ? Number(rows[0].total) : 0 }));
});
const barePort = await listen(bare);

// Sign in once, as a browser would, and reuse the session cookie.
const first = await fetch(`http://127.0.0.1:${appPort}/api/session`);
const cookie = first.headers.get('set-cookie')!.split(';')[0];
const { csrfToken } = await first.json();
const signIn = await fetch(`http://127.0.0.1:${appPort}/api/session`, {
  method: 'POST', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password: PASSWORD }),
});
// The answer also clears the signed-out visitor's CSRF cookie; the session cookie is the one to keep.
const session = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).find((c) => c.startsWith('nestflow.sid='));
if (!signIn.ok || !session) throw new Error(`sign-in answered ${signIn.status} without a session cookie`);
const appUrl = `http://127.0.0.1:${appPort}/api/infants?status=on_oxygen&sort=-elevation&page=3&pageSize=25`;

const appRates: number[] = [];
const bareRates: number[] = [];
await load(appUrl, { cookie: session });
await load(`http://127.0.0.1:${barePort}/`, {});
for (let round = 0; round < 3; round++) {
  bareRates.push(await load(`http://127.0.0.1:${barePort}/`, {}));
  appRates.push(await load(appUrl, { cookie: session }));
}
console.log(`caseload list, ${BABIES.toLocaleString('en')} babies, ${REQUESTS} requests × 3 rounds, concurrency ${CONCURRENCY}`);
console.log(`  bare node:http + pg   median ${median(bareRates).toFixed(0)} req/s`);
console.log(`  Nestflow API          median ${median(appRates).toFixed(0)} req/s`);
console.log(`  ratio (target ≥ 0.65) ${(median(appRates) / median(bareRates)).toFixed(2)}×`);
app.close();
bare.close();
await pool.end();
await closeDeps(deps);
process.exit(0);
