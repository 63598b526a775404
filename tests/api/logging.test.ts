import { Writable } from 'node:stream';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/lib/logger';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { post } from '../helpers/approved-baby';

// The log an operator reads: one JSON line per API request with its id, the same id in error bodies, and nothing
// that identifies a family or a baby, nor a clinical value, whatever the routes are given.
const NOW = new Date('2026-11-24T10:00:00Z');
let ctx: TestContext;
let app: Express;
const lines: string[] = [];
const sink = new Writable({
  write(chunk, _enc, done) {
    lines.push(...String(chunk).split('\n').filter(Boolean));
    done();
  },
});
const SECRETS = { given: 'Quillon', family: 'Ashvale-Pettigrew', parent: 'Morwenna Tregothnan', mobile: '+44 7700 900457', email: 'morwenna.tregothnan@family.example', note: 'called 07700 900458 after SpO2 86 %' };
let badRequestId = '';
let headerId = '';

beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
  ctx.deps.logger = createLogger('debug', 'api', sink);
  app = createApp(ctx.deps);
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(app, clinic.people.coordinator.email);
  const body = enrolmentBody(clinic, { familyEmail: SECRETS.email });
  body.baby.givenName = SECRETS.given;
  body.baby.familyName = SECRETS.family;
  body.contacts[0]!.name = SECRETS.parent;
  body.contacts[0]!.mobile = SECRETS.mobile;
  const infant = (await post(coord, '/api/infants', body).expect(201)).body;
  const nurse = await signedInAgent(app, clinic.people.nurse.email);
  await post(nurse, `/api/infants/${infant.id}/readings`, { takenAt: new Date(Date.now() - 60_000).toISOString(), spo2: 86, pulse: 151, state: 'asleep', notes: SECRETS.note });
  await coord.get('/api/messages').query({ q: SECRETS.family });
  await coord.get(`/api/infants?q=${encodeURIComponent(SECRETS.given)}`);
  // A refused sign-in for the family's address, and a bad body naming the baby.
  const anon = await anonymousAgent(app);
  await anon.post('/api/session').set('X-CSRF-Token', anon.csrf).send({ email: SECRETS.email, password: 'wrong password for the log test' });
  const bad = await post(coord, '/api/infants', { baby: { givenName: SECRETS.given, familyName: SECRETS.family } }).set('X-Request-Id', 'trace-from-proxy-0001');
  badRequestId = bad.body.error?.requestId;
  headerId = bad.headers['x-request-id'];
  // Direct calls with the kinds of field a careless log line could carry.
  ctx.deps.logger.warn(`delivery failed for ${SECRETS.email} on ${SECRETS.mobile}`, { to: SECRETS.mobile, familyName: SECRETS.family, reading: { spo2: 86, pulse: 151 }, err: new Error(`SMTP refused ${SECRETS.email}`) });
  ctx.deps.logger.info('SpO2 86 % during the night, saturation: 84');
  await new Promise((r) => setTimeout(r, 50));
});
afterAll(() => ctx.close());

const parsed = () => lines.map((l) => JSON.parse(l) as Record<string, unknown> & { req?: { id?: string; path?: string }; reqId?: string });

describe('the API log', () => {
  it('when requests are made, then each gets one JSON access line with its id, method, path without the query, status and time', () => {
    const access = parsed().filter((l) => l.msg === 'request' || l.msg === 'request failed');
    expect(access.length).toBeGreaterThanOrEqual(8);
    for (const line of access) {
      expect(line.req?.id, JSON.stringify(line)).toMatch(/^[A-Za-z0-9._:-]{8,100}$/);
      expect(line.req?.path).not.toContain('?');
      expect(typeof line.responseTime).toBe('number');
      expect(line.level).toMatch(/^(info|warn|error)$/);
    }
    expect(access.map((l) => l.req?.path)).toContain('/api/messages');
  });

  it('when a request fails, then its error body and X-Request-Id header carry the id a proxy sent, and its log line has it', () => {
    expect(badRequestId).toBe('trace-from-proxy-0001');
    expect(headerId).toBe('trace-from-proxy-0001');
    const line = parsed().find((l) => l.req?.id === 'trace-from-proxy-0001');
    expect(line).toMatchObject({ level: 'warn', res: { status: 400 } });
  });

  it('when names, phone numbers, e-mail addresses, notes and SpO2 values pass through, then none of them reaches the log', () => {
    const all = lines.join('\n');
    for (const secret of [SECRETS.given, SECRETS.family, SECRETS.parent, SECRETS.email, '7700 900457', '+447700900457', '07700 900458', 'SpO2 86', 'saturation: 84']) {
      expect(all, `the log holds "${secret}"`).not.toContain(secret);
    }
    const direct = parsed().find((l) => String(l.msg).startsWith('delivery failed'));
    expect(direct).toMatchObject({ to: '[redacted]', familyName: '[redacted]', reading: { spo2: '[redacted]', pulse: '[redacted]' } });
    expect(parsed().find((l) => String(l.msg).includes('during the night'))?.msg).toBe('SpO2 [redacted] during the night, saturation: [redacted]');
  });
});
