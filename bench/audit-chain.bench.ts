// The cost of hash-chaining the audit trail (migration 1766102400000): read-audit INSERTs through the chaining trigger
// against the same INSERTs into a copy of the table without it, one programme's chain (every insert waits its turn)
// against sixteen, reads of one programme while its changes hold the chain head until they commit, and how fast a
// chain is verified. Prints figures only; never fails on a number.
import 'reflect-metadata';
import pg from 'pg';
import { createDataSource } from '../server/db/data-source';
import { createAuditChainRepository } from '../server/db/repositories/audit-chain.repository';
import { verifyChain } from '../server/modules/audit/chain-verify';

const ADMIN_URL = process.env.BENCH_ADMIN_URL ?? 'postgres://postgres@127.0.0.1:54329/postgres';
const URL = process.env.BENCH_AUDIT_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/nestflow_auditbench';
const INSERTS = 4_000;
const CONCURRENCY = 16;

const admin = new pg.Client({ connectionString: ADMIN_URL });
await admin.connect();
if (!(await admin.query(`SELECT 1 FROM pg_database WHERE datname = 'nestflow_auditbench'`)).rowCount) await admin.query('CREATE DATABASE nestflow_auditbench');
await admin.end();
const ds = createDataSource(URL, { applicationName: 'nestflow-bench-audit', quiet: true });
await ds.initialize();
await ds.runMigrations({ transaction: 'each' });
const pool = new pg.Pool({ connectionString: URL, max: CONCURRENCY + 8 });

const programmes: string[] = [];
const users: string[] = [];
for (let i = 0; i < CONCURRENCY; i += 1) {
  const slug = `audit-bench-${Date.now().toString(36)}-${i}`;
  const p = (await pool.query(`INSERT INTO programmes (slug, name, time_zone) VALUES ($1, $1, 'Europe/London') RETURNING id`, [slug])).rows[0].id as string;
  programmes.push(p);
  users.push((await pool.query(`INSERT INTO users (programme_id, email, name, role) VALUES ($1, $2, 'Bench reader', 'nurse') RETURNING id`, [p, `${slug}@bench.example`])).rows[0].id);
}
await pool.query(`DROP TABLE IF EXISTS audit_plain`);
await pool.query(`CREATE UNLOGGED TABLE audit_plain (LIKE audit_events INCLUDING DEFAULTS)`);
await pool.query(`ALTER TABLE audit_plain ALTER COLUMN chain_seq DROP NOT NULL, ALTER COLUMN prev_hash DROP NOT NULL, ALTER COLUMN row_hash DROP NOT NULL`);

const ms = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e6;
const pct = (v: number[], p: number) => [...v].sort((a, b) => a - b)[Math.min(v.length - 1, Math.floor(v.length * p))]!;

/** `count` single-statement inserts, `CONCURRENCY` at a time; chain i % chains. */
async function inserts(table: string, chains: number, count = INSERTS) {
  const times: number[] = [];
  let next = 0;
  const started = process.hrtime.bigint();
  await Promise.all(Array.from({ length: CONCURRENCY }, async () => {
    while (next < count) {
      const i = next++;
      const t = process.hrtime.bigint();
      await pool.query(
        `INSERT INTO ${table} (programme_id, actor_id, kind, action, entity_type, entity_id, ip) VALUES ($1, $2, 'read', 'infant.viewed', 'infant', $3, '127.0.0.1')`,
        [programmes[i % chains], users[i % chains], `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`]);
      times.push(ms(t));
    }
  }));
  const total = ms(started);
  return { 'inserts/s': Math.round((count / total) * 1000), 'p50 ms': pct(times, 0.5).toFixed(2), 'p99 ms': pct(times, 0.99).toFixed(2) };
}

console.log(`audit inserts: ${INSERTS.toLocaleString('en')} single-statement reads, ${CONCURRENCY} connections`);
console.table({
  'no chain (copy of the table, no triggers)': await inserts('audit_plain', 1),
  'chained, one programme': await inserts('audit_events', 1),
  'chained, 16 programmes': await inserts('audit_events', CONCURRENCY),
});

// Changes that hold their chain head for 20 ms before committing, while reads of the same and another programme go on.
async function readsDuringChanges(sameChain: boolean, auditLast: boolean) {
  let stop = false;
  const changes = Array.from({ length: 4 }, async () => {
    while (!stop) {
      const c = await pool.connect();
      try {
        await c.query('BEGIN');
        const append = () => c.query(`INSERT INTO audit_events (programme_id, actor_id, action, entity_type) VALUES ($1, $2, 'infant.updated', 'infant')`, [programmes[0], users[0]]);
        // The rest of the change's work: before its audit row (the rule in DEVELOPERS.md) or after it.
        if (auditLast) {
          await c.query('SELECT pg_sleep(0.02)');
          await append();
        } else {
          await append();
          await c.query('SELECT pg_sleep(0.02)');
        }
        await c.query('COMMIT');
      } finally {
        c.release();
      }
    }
  });
  const times: number[] = [];
  const chain = sameChain ? 0 : 1;
  for (let i = 0; i < 300; i += 1) {
    const t = process.hrtime.bigint();
    await pool.query(`INSERT INTO audit_events (programme_id, actor_id, kind, action, entity_type, entity_id) VALUES ($1, $2, 'read', 'infant.viewed', 'infant', 'x')`, [programmes[chain], users[chain]]);
    times.push(ms(t));
  }
  stop = true;
  await Promise.all(changes);
  return { 'read p50 ms': pct(times, 0.5).toFixed(2), 'read p99 ms': pct(times, 0.99).toFixed(2) };
}
console.log('\nreads recorded while 4 connections keep changing one programme (each change takes 20 ms)');
console.table({
  'same programme, audit row last in each change': await readsDuringChanges(true, true),
  'same programme, audit row first (held 20 ms)': await readsDuringChanges(true, false),
  'another programme': await readsDuringChanges(false, false),
});

const repo = createAuditChainRepository(ds);
const t = process.hrtime.bigint();
const result = await verifyChain(repo, programmes[0]!);
const took = ms(t);
console.log(`\nverifying one chain: ${result.rowsChecked.toLocaleString('en')} rows in ${took.toFixed(0)} ms (${Math.round(result.rowsChecked / (took / 1000)).toLocaleString('en')} rows/s), ok: ${result.ok}`);

await pool.query(`DROP TABLE audit_plain`);
await pool.end();
await ds.destroy();
process.exit(0);
