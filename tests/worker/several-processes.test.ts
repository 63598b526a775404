import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createServer } from 'node:net';
import { Queue } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeSms, type FakeSms, type FakeSmsMessage } from '../../fakes/sms/app';
import { QUEUES } from '@shared/jobs/catalogue';
import { redisConnection } from '../../worker/queues';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { TEST_PASSWORD } from '../helpers/factories';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { policyWithoutQuietHours, waitFor } from '../helpers/messaging';
import { csvFromSamples, steadySamples } from '../fixtures/recordings/build-csv';

// Several machines, proved on loopback: two API processes and two worker processes, all from the compiled dist/
// (npm run build), on one PostgreSQL and one Redis. Bounded: fixed counts, time-outs, loopback only.
const REMINDERS = 1000;
const PAIR_LIMIT = 3;
const prefix = `multi${Math.random().toString(36).slice(2, 8)}`;

let ctx: TestContext;
let sms: FakeSms;
let programmeId: string;
let infantId: string;
let clinic: Awaited<ReturnType<typeof makeClinic>>;
const apis: Array<{ port: number; proc: ChildProcess }> = [];
const workers: ChildProcess[] = [];
const figures: Record<string, unknown> = {};

const freePort = () => new Promise<number>((resolve) => {
  const s = createServer().listen(0, '127.0.0.1', () => {
    const { port } = s.address() as { port: number };
    s.close(() => resolve(port));
  });
});

const sharedEnv = () => ({
  ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'error', DATABASE_URL: process.env.DATABASE_URL!, REDIS_URL: process.env.REDIS_URL!, QUEUE_PREFIX: prefix,
  SMS_API_BASE: `http://127.0.0.1:${sms.port}`, REMINDER_RECONCILE_MS: '1000', REMINDER_BACKOFF_MS: '100', REMINDER_CONCURRENCY: '8', SEND_TIMEOUT_MS: '2000',
  SIGNIN_PAIR_LIMIT: String(PAIR_LIMIT), SIGNIN_IP_LIMIT: '1000', MAIL_SEARCH_URL: '',
});

function startWorker(): ChildProcess {
  const proc = spawn(process.execPath, ['dist/worker/main.js'], { env: sharedEnv(), stdio: 'ignore' });
  workers.push(proc);
  return proc;
}

async function startApi(): Promise<{ port: number; proc: ChildProcess }> {
  const port = await freePort();
  const proc = spawn(process.execPath, ['dist/server/main.js'], { env: { ...sharedEnv(), PORT: String(port), HOST: '127.0.0.1' }, stdio: 'ignore' });
  await waitFor(`API on ${port}`, () => fetch(`http://127.0.0.1:${port}/api/health/live`).then((r) => r.ok, () => false), 30_000, 100);
  return { port, proc };
}

const kill9 = async (p: ChildProcess) => {
  if (p.exitCode !== null || p.signalCode !== null) return;
  const gone = new Promise((r) => p.once('exit', r));
  p.kill('SIGKILL');
  await gone;
};

/** What the few answers read here hold. */
interface ApiBody { id?: string; csrfToken?: string; user?: { email?: string } | null; [key: string]: unknown }

/** A minimal browser: keeps cookies (by name, for any of our loopback ports) and the form token. */
class Client {
  cookies = new Map<string, string>();
  csrf = '';
  async call(port: number, method: string, path: string, body?: unknown | FormData): Promise<{ status: number; body: ApiBody }> {
    const headers: Record<string, string> = { cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ') };
    if (method !== 'GET') headers['x-csrf-token'] = this.csrf;
    if (body !== undefined && !(body instanceof FormData)) headers['content-type'] = 'application/json';
    const res = await fetch(`http://127.0.0.1:${port}${path}`, { method, headers, body: body === undefined ? undefined : body instanceof FormData ? body : JSON.stringify(body) });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const at = pair!.indexOf('=');
      this.cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
    const text = await res.text();
    const parsed = text && res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text;
    if (parsed && typeof parsed === 'object' && 'csrfToken' in parsed) this.csrf = parsed.csrfToken;
    return { status: res.status, body: parsed };
  }
  async signIn(port: number, email: string, password = TEST_PASSWORD) {
    await this.call(port, 'GET', '/api/session');
    return this.call(port, 'POST', '/api/session', { email, password });
  }
}

async function providerLog(): Promise<FakeSmsMessage[]> {
  return (await fetch(`http://127.0.0.1:${sms.port}/messages`)).json();
}

beforeAll(async () => {
  if (!existsSync('dist/server/main.js') || !existsSync('dist/worker/main.js')) throw new Error('Run `npm run build` first: this test starts the compiled API and worker from dist/.');
  ctx = await createTestContext({ QUEUE_PREFIX: prefix });
  sms = await startFakeSms({ port: 0, accountSid: ctx.deps.env.TWILIO_ACCOUNT_SID, authToken: ctx.deps.env.TWILIO_AUTH_TOKEN, ourNumber: ctx.deps.env.TWILIO_FROM });
  clinic = await makeClinic(ctx.deps);
  programmeId = clinic.programme.id;
  await policyWithoutQuietHours(ctx.deps, programmeId);
  const t0 = Date.now();
  apis.push(await startApi(), await startApi());
  startWorker();
  startWorker();
  await waitFor('both workers to report a heartbeat', async () => {
    const res = await fetch(`http://127.0.0.1:${apis[0]!.port}/api/health/ready`).then((r) => r.json());
    return res.workers?.running === 2;
  }, 60_000, 200);
  figures.startSeconds = (Date.now() - t0) / 1000;
}, 120_000);

afterAll(async () => {
  await Promise.all([...apis.map((a) => kill9(a.proc)), ...workers.map(kill9)]);
  await sms?.close();
  await ctx?.close();
  console.info('several processes: figures', figures);
});

describe('two API processes and two workers on one PostgreSQL and one Redis', () => {
  it('when a person signs in on API 1, then API 2 knows the session, and a write with its form token works there', async () => {
    const [a, b] = apis;
    const coord = new Client();
    expect((await coord.signIn(a!.port, clinic.people.coordinator.email)).status).toBe(200);
    const me = await coord.call(b!.port, 'GET', '/api/session');
    expect(me.body.user?.email).toBe(clinic.people.coordinator.email);
    const enrolled = await coord.call(b!.port, 'POST', '/api/infants', enrolmentBody(clinic));
    expect(enrolled.status).toBe(201);
    infantId = enrolled.body.id!;
  });

  it('when wrong passwords alternate between the two APIs, then the sign-in limit counts them together', async () => {
    const [a, b] = apis;
    const who = clinic.people.nurse.email;
    const statuses: number[] = [];
    for (let i = 0; i < PAIR_LIMIT + 1; i++) {
      const c = new Client();
      statuses.push((await c.signIn((i % 2 ? b : a)!.port, who, 'not the password at all')).status);
    }
    figures.signInStatuses = statuses;
    expect(statuses.slice(0, PAIR_LIMIT)).toEqual(Array(PAIR_LIMIT).fill(401));
    expect(statuses[PAIR_LIMIT]).toBe(429);
    // The right password from the same address is now refused on either process too.
    expect((await new Client().signIn(b!.port, who)).status).toBe(429);
  });

  it('when a baby is enrolled and a recording uploaded, then its conversion and the analysis each run exactly once', async () => {
    await waitFor('the proposal to be computed', async () => {
      const [row] = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM prescriptions WHERE infant_id = $1 AND status = 'proposed'`, [infantId]);
      return row.n === 1;
    }, 30_000, 100);
    const uploader = new Client();
    expect((await uploader.signIn(apis[1]!.port, clinic.people.coordinator.email)).status).toBe(200);
    const form = new FormData();
    form.set('timeFormat', 'iso');
    form.set('file', new Blob([csvFromSamples(steadySamples(3600))], { type: 'text/csv' }), 'night.csv');
    const up = await uploader.call(apis[1]!.port, 'POST', `/api/infants/${infantId}/recordings`, form);
    expect(up.status, JSON.stringify(up.body)).toBe(202);
    await waitFor('the analysis', async () => {
      const [row] = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM recording_analyses a JOIN recordings r ON r.id = a.recording_id WHERE r.infant_id = $1`, [infantId]);
      return row.n >= 1;
    }, 60_000, 100);
    // Give a second worker time to have (wrongly) repeated either job before counting.
    await new Promise((r) => setTimeout(r, 2000));
    const [counts] = await ctx.deps.ds.query(
      `SELECT (SELECT count(*)::int FROM audit_events WHERE entity_id = $1::text AND action = 'prescription.proposed') AS proposed,
              (SELECT count(*)::int FROM audit_events WHERE entity_id = $1::text AND action = 'recording.analysed') AS analysed,
              (SELECT count(*)::int FROM recording_analyses a JOIN recordings r ON r.id = a.recording_id WHERE r.infant_id = $2) AS analyses`,
      [infantId, infantId],
    );
    figures.jobsRun = counts;
    expect(counts).toEqual({ proposed: 1, analysed: 1, analyses: 1 });
  }, 90_000);

  it('when both workers have started, then each schedule exists once', async () => {
    const maintenance = new Queue(QUEUES.maintenance, { connection: redisConnection(process.env.REDIS_URL!), prefix });
    try {
      const schedulers = await maintenance.getJobSchedulers(0, -1);
      const ids = schedulers.map((s) => s.key).sort();
      figures.schedules = ids.length;
      expect(ids).toEqual(['daily-schedule', 'plan-digests', 'prune-sessions-hourly', 'reanalyse-recordings', 'reconcile-conversions', 'reconcile-reminders', 'verify-audit-chain']);
    } finally {
      await maintenance.close();
    }
  });

  it(`when ${REMINDERS} reminders fall due and one worker is killed mid-burst, then each is delivered exactly once`, async () => {
    await ctx.deps.ds.query(
      `INSERT INTO family_contacts (infant_id, programme_id, name, relation, mobile, email, preferred_channel, consent_sms, consent_email, language, time_zone, position)
       SELECT $1, $2, 'Multi ' || n, 'Parent', '+4477009' || lpad(n::text, 5, '0'), NULL, 'sms', true, false, 'en', 'Europe/London', 10
         FROM generate_series(1, $3) AS n`,
      [infantId, programmeId, REMINDERS],
    );
    const rows: Array<{ id: string }> = await ctx.deps.ds.query(
      `INSERT INTO reminders (programme_id, infant_id, template, contact_id, recipient_name, channel, to_address, language, time_zone, data, dedupe_key, send_at)
       SELECT $1, $2, 'visit-morning', c.id, c.name, 'sms', c.mobile, 'en', 'Europe/London',
              jsonb_build_object('babyName', 'Multi', 'kind', 'home_visit', 'startsAt', (now() + interval '1 day')::text, 'date', '2030-01-01',
                                 'time', '10:00', 'timeZone', 'Europe/London', 'staffName', 'Nurse Multi', 'purpose', 'Check'),
              'multi-' || c.id, now()
         FROM family_contacts c WHERE c.infant_id = $2 AND c.name LIKE 'Multi %'
       RETURNING id`,
      [programmeId, infantId],
    );
    const ids = rows.map((r) => r.id);
    const t0 = Date.now();
    await waitFor('the burst to be under way', async () => (await providerLog()).filter((m) => m.to.startsWith('+4477009')).length >= 150, 60_000, 20);
    await kill9(workers[0]!);
    const atKill = (await providerLog()).filter((m) => m.to.startsWith('+4477009')).length;
    await waitFor('every reminder to be sent', async () => {
      const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM reminders WHERE id = ANY($1) AND status = 'sent'`, [ids]);
      return n === ids.length;
    }, 150_000, 250);
    // Other test files share the database, and these workers deliver whatever falls due in it: a message of theirs
    // may go to a number of this range too, with its own text. This burst's message to a number is the one its
    // reminder recorded (provider id); a second copy of that same text to that number is a duplicate.
    const sent: Array<{ to_address: string; provider_id: string }> = await ctx.deps.ds.query(`SELECT to_address, provider_id FROM reminders WHERE id = ANY($1)`, [ids]);
    const all = await providerLog();
    const bySid = new Map(all.map((m) => [m.sid, m]));
    const burstText = new Map(sent.map((r) => [r.to_address, bySid.get(r.provider_id)?.body]));
    const log = all.filter((m) => burstText.get(m.to) === m.body);
    const perNumber = new Map<string, number>();
    for (const m of log) perNumber.set(m.to, (perNumber.get(m.to) ?? 0) + 1);
    figures.reminders = { planned: ids.length, deliveredAtKill: atKill, delivered: perNumber.size, duplicated: log.length - perNumber.size,
      otherTestsMessages: all.filter((m) => m.to.startsWith('+4477009')).length - log.length, seconds: (Date.now() - t0) / 1000 };
    expect(atKill).toBeLessThan(REMINDERS);
    expect(perNumber.size).toBe(REMINDERS);
    expect(log).toHaveLength(REMINDERS);
  }, 200_000);
});
