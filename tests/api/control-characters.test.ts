import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const post = (a: Agent, path: string, body: object) => a.post(path).set('X-CSRF-Token', a.csrf).send(body);
const count = async (table: string) => Number((await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM ${table}`))[0].n);

describe('control characters in real requests: 400 naming the field, nothing stored', () => {
  it('when a baby is enrolled with a NUL in its name or an escape in the address, then 400 on those fields and no baby is stored', async () => {
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const body = enrolmentBody(clinic);
    body.baby.givenName = 'Wr\u0000en';
    body.home.address = '2 Mill Row\u001b[2J';
    const before = await count('infants');
    const res = await post(coord, '/api/infants', body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['baby.givenName', 'home.address']);
    expect(await count('infants')).toBe(before);
  });

  it('when searching the caseload or the people list with a NUL, then 400 on q', async () => {
    const clinic = await makeClinic(ctx.deps);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const people = await admin.get('/api/users?q=%00');
    expect(people.status).toBe(400);
    expect(Object.keys(people.body.error.details)).toEqual(['query.q']);
    const caseload = await coord.get('/api/infants?q=a%00b');
    expect(caseload.status).toBe(400);
    expect(Object.keys(caseload.body.error.details)).toEqual(['query.q']);
  });

  it('when a person is added with a NUL in the name, then 400 and no one is added or e-mailed', async () => {
    const clinic = await makeClinic(ctx.deps);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    const before = await count('users');
    const res = await post(admin, '/api/users', { email: 'nul-name@test.example', name: 'Ada\u0000 Pennick', role: 'nurse' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details)).toEqual(['name']);
    expect(await count('users')).toBe(before);
    expect(ctx.mail.messages().filter((m) => m.envelope.to.includes('nul-name@test.example'))).toHaveLength(0);
  });
});
