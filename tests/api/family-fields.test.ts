import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { approvedBaby, post } from '../helpers/approved-baby';
import { buildAndWalk, type MountedRoute } from '../helpers/route-walk';

// Privacy: a family reads its own baby's plan in plain words and never a staff-only field. Generated over every
// mounted GET route: each is called as the family with every id of their baby's records, and no answer may carry
// a staff-only field with a value, nor any of the staff notes planted below.
const NOW = new Date('2027-03-15T12:00:00Z');
const STAFF_ONLY_KEYS = ['working', 'conversion', 'evidence', 'decisionReason', 'overrideReason', 'checks', 'requiredFlowLpm', 'proposedFlowLpm', 'approvedFio2', 'input', 'passwordHash', 'ip'];
const SECRETS = ['STAFF-READING-NOTE-7731', 'NURSE-REQUEST-REASON-7731', 'OVERRIDE-REASON-7731', 'CONSULTANT-DECISION-7731'];

let ctx: TestContext;
let app: Express;
let routes: MountedRoute[];
let family: Agent;
let ids: string[];

const isEmpty = (v: unknown) => v === null || v === undefined || (Array.isArray(v) && v.length === 0) || (typeof v === 'object' && Object.keys(v as object).length === 0);

/** Paths of staff-only keys that hold a value anywhere in a JSON answer. */
function staffOnlyValues(value: unknown, at = '$'): string[] {
  if (Array.isArray(value)) return value.flatMap((v, i) => staffOnlyValues(v, `${at}[${i}]`));
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => [
    ...(STAFF_ONLY_KEYS.includes(k) && !isEmpty(v) ? [`${at}.${k}`] : []),
    ...staffOnlyValues(v, `${at}.${k}`),
  ]);
}

beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
  ({ app, routes } = buildAndWalk(() => createApp(ctx.deps)));
  const b = await approvedBaby(ctx.deps, app);
  const { infant, clinic, consultant } = b;
  family = await signedInAgent(app, clinic.people.family.email);
  const nurse = await signedInAgent(app, clinic.people.nurse.email);
  const reading = (await post(nurse, `/api/infants/${infant.id}/readings`, { takenAt: new Date(Date.now() - 60_000).toISOString(), spo2: 95, state: 'asleep', notes: SECRETS[0] }).expect(201)).body;
  const ask = (await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: SECRETS[1], overrideReason: SECRETS[2] }).expect(201)).body;
  await post(consultant, `/api/prescriptions/${ask.id}/decision`, { decision: 'approve', reason: SECRETS[3] }).expect(200);
  ids = [infant.id, b.rx.id, ask.id, reading.id];
});
afterAll(() => ctx.close());

describe('what a family can read', () => {
  it('when the family calls every GET route with each id of their baby, then no answer holds a staff-only field or note', async () => {
    // The OpenAPI description names every field of every contract (staff ones too) but holds no record's values.
    const gets = routes.filter((r) => r.method === 'get' && r.path.startsWith('/api/') && !r.path.includes('{*') && r.path !== '/api/openapi.json');
    expect(gets.length).toBeGreaterThan(20);
    const answered: string[] = [];
    for (const route of gets) {
      const paths = route.path.includes(':') ? ids.map((id) => route.path.replace(/:[A-Za-z]+/g, id)) : [route.path];
      for (const path of paths) {
        const res = await family.get(path);
        if (res.status !== 200 || !res.type.includes('json')) continue;
        answered.push(route.path);
        expect(staffOnlyValues(res.body), `${path} holds staff-only fields`).toEqual([]);
        const text = JSON.stringify(res.body);
        for (const secret of SECRETS) expect(text.includes(secret), `${path} shows a staff note`).toBe(false);
      }
    }
    // The routes that return this baby's data to its family were reached, the single setting among them.
    expect(answered).toEqual(expect.arrayContaining(['/api/prescriptions/:id', '/api/infants/:id', '/api/infants/:id/prescriptions']));
  });

  it('when the family reads the approved step down directly, then it is the plan only, as in the list', async () => {
    const list = (await family.get(`/api/infants/${ids[0]}/prescriptions`).expect(200)).body.items;
    const one = (await family.get(`/api/prescriptions/${ids[2]}`).expect(200)).body;
    expect(one).toEqual(list.find((p: { id: string }) => p.id === ids[2]));
    expect(one).toMatchObject({ status: 'active', evidence: null, decisionReason: null, conversion: null, input: {} });
  });
});
