// docs/service-targets.md P4: an overnight recording (43,200 samples at 1 Hz) read, checked and encoded for storage, against a
// raw PostgreSQL COPY of the same rows (the floor), measured alternately in one run; ratios are the figures that
// count on a shared machine. Prints only; never fails on a number. Skips the database parts if it is not reachable.
import { createHash } from 'node:crypto';
import pg from 'pg';
import { parse as csvParseSync } from 'csv-parse/sync';
import { summariseOximetry } from '@shared/clinical/oximetry';
import { parseRecordingCsv } from '@shared/recordings/recording-parser';
import { decodeSamples, encodeSamples, type EncodedSamples } from '@shared/recordings/sample-codec';
import { buildNoisyTrace } from '../tests/shared/clinical/helpers/synthetic-oximetry';

const DATABASE_URL = process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/nestflow';
const ROUNDS = 15;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

function nightCsv(samples = buildNoisyTrace(43_200)): Buffer {
  const start = Date.UTC(2026, 10, 20, 20, 0, 0);
  const lines = ['timestamp,spo2,pulse,status'];
  for (const s of samples) {
    lines.push(`${new Date(start + s.tSec * 1000).toISOString()},${s.spo2 ?? ''},${s.pulse ?? ''},${s.flagged ? 'low signal' : 'ok'}`);
  }
  return Buffer.from(lines.join('\n') + '\n', 'utf8');
}

/** The API's in-process work for one upload: strict UTF-8, SHA-256, parse and validate, encode. */
function readAndEncode(bytes: Buffer): EncodedSamples {
  const text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  createHash('sha256').update(bytes).digest('hex');
  const parsed = parseRecordingCsv(text);
  if (!parsed.ok) throw new Error(parsed.problem.message);
  return encodeSamples(parsed.recording.samples);
}

/** COPY … FROM STDIN over node-postgres's own connection (the copy-in messages of the wire protocol). */
function copyIn(client: pg.Client, sql: string, data: Buffer): Promise<void> {
  return new Promise((resolve, reject) => {
    let failure: unknown = null;
    const noop = () => undefined;
    const query = {
      submit: (connection: { query(text: string): void }) => connection.query(sql),
      handleCopyInResponse(connection: { sendCopyFromChunk(b: Buffer): void; endCopyFrom(): void }) {
        for (let at = 0; at < data.length; at += 1 << 16) connection.sendCopyFromChunk(data.subarray(at, at + (1 << 16)));
        connection.endCopyFrom();
      },
      handleError: (err: unknown) => void (failure = err),
      handleReadyForQuery: () => (failure ? reject(failure) : resolve()),
      handleCommandComplete: noop, handleRowDescription: noop, handleDataRow: noop, handleEmptyQuery: noop, handlePortalSuspended: noop, handleCopyData: noop,
    };
    client.query(query as never);
  });
}

async function time(fn: () => unknown) {
  const t = process.hrtime.bigint();
  await fn();
  return Number(process.hrtime.bigint() - t) / 1e6;
}

async function connect(): Promise<pg.Client | null> {
  const client = new pg.Client({ connectionString: DATABASE_URL, connectionTimeoutMillis: 3000 });
  client.on('error', () => undefined);
  try {
    await client.connect();
    return client;
  } catch (err) {
    console.log(`recordings bench: database not reachable (${(err as Error).message}); COPY comparison skipped`);
    return null;
  }
}

const bytes = nightCsv();
const encoded = readAndEncode(bytes);
const decoded = decodeSamples(encoded);
const text = bytes.toString('utf8');
const figures: Record<string, number[]> = { read: [], store: [], copy: [], analyse: [], csvParse: [] };
const client = await connect();
if (client) {
  await client.query(`CREATE TEMP TABLE bench_rows (ts timestamptz, spo2 real, pulse real, status text)`);
  // Compressed as the migration sets recording_samples up.
  await client.query(`CREATE TEMP TABLE bench_samples (id serial PRIMARY KEY, offsets bytea COMPRESSION lz4, spo2 bytea COMPRESSION lz4, pulse bytea COMPRESSION lz4, flags bytea COMPRESSION lz4)`);
}
// The upload paths and the COPY alternate in one loop; the references run after it, so the garbage a reference
// leaves behind is never collected inside a measured upload.
for (let round = 0; round < ROUNDS + 1; round += 1) {
  const keep = round > 0; // the first round warms up
  const read = await time(() => readAndEncode(bytes));
  if (keep) figures.read.push(read);
  if (!client) continue;
  await client.query('TRUNCATE bench_rows, bench_samples');
  const copy = await time(() => copyIn(client, `COPY bench_rows FROM STDIN (FORMAT csv, HEADER true)`, bytes));
  const store = await time(async () => {
    const e = readAndEncode(bytes);
    await client.query('BEGIN');
    await client.query(`INSERT INTO bench_samples (offsets, spo2, pulse, flags) VALUES ($1, $2, $3, $4)`, [e.offsets, e.spo2, e.pulse, e.flags].map((a) => Buffer.from(a.buffer, a.byteOffset, a.byteLength)));
    await client.query('COMMIT');
  });
  if (keep) {
    figures.copy.push(copy);
    figures.store.push(store);
  }
}
for (let round = 0; round < ROUNDS + 1; round += 1) {
  const analyse = await time(() => summariseOximetry(decodeSamples(encoded)));
  if (round > 0) figures.analyse.push(analyse);
}
for (let round = 0; round < 6; round += 1) {
  const csvParse = await time(() => csvParseSync(text));
  if (round > 0) figures.csvParse.push(csvParse);
}
const m = Object.fromEntries(Object.entries(figures).map(([k, v]) => [k, v.length ? median(v) : NaN]));
const line = (label: string, ms: number, extra = '') => console.log(`${label.padEnd(58)} median ${ms.toFixed(1).padStart(7)} ms${extra}`);
console.log(`recordings bench: one night, ${decoded.length.toLocaleString('en')} samples at 1 Hz, ${(bytes.length / 1e6).toFixed(2)} MB CSV; ${ROUNDS} rounds`);
line('read + validate + encode (UTF-8, SHA-256, parse, pack)', m.read);
line('analysis (decode + summariseOximetry)', m.analyse);
line('reference: csv-parse/sync on the same text (rows only)', m.csvParse);
if (client) {
  line('raw COPY of the same rows into a temp table (floor)', m.copy);
  line('read + validate + encode + INSERT one compact row', m.store);
  console.log(`  ratio read+validate+encode / COPY          ${(m.read / m.copy).toFixed(2)}×`);
  console.log(`  ratio stored (with INSERT) / COPY           ${(m.store / m.copy).toFixed(2)}×`);
  console.log(`  ratio stored + analysed / COPY (P4, ≤ 3×)   ${((m.store + m.analyse) / m.copy).toFixed(2)}×`);
  await client.end();
}
