import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic } from '../helpers/infants';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);

async function baby() {
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const body = enrolmentBody(clinic, { familyEmail: clinic.people.family.email });
  body.contacts[0].timeZone = 'America/Denver';
  const infant = (await post(coord, '/api/infants', body).expect(201)).body;
  return { clinic, coord, infant };
}

const visit = (staffId: string, over: Record<string, unknown> = {}) => ({ kind: 'home_visit', date: future(3), time: '10:00', durationMinutes: 45, staffId, purpose: 'Spot check and weight', ...over });

describe('visits', () => {
  it("when the coordinator books a visit, then it is stored in the family's time zone and audited", async () => {
    const { clinic, coord, infant } = await baby();
    const res = await post(coord, `/api/infants/${infant.id}/visits`, visit(clinic.people.nurse.id)).expect(201);
    expect(res.body).toMatchObject({ date: future(3), time: '10:00', timeZone: 'America/Denver', status: 'booked', staff: { id: clinic.people.nurse.id } });
    // 10:00 in Denver is 17:00 UTC in winter (UTC−7) or 16:00 in summer (UTC−6).
    expect(['17:00', '16:00']).toContain(res.body.startsAt.slice(11, 16));
    const audit = await ctx.deps.repos.audit.listForEntity('infant', infant.id);
    expect(audit.some((a) => a.action === 'visit.booked')).toBe(true);
  });

  it('when a visit is moved or cancelled, then the change is kept with its reason; a stale move gets 409', async () => {
    const { clinic, coord, infant } = await baby();
    const v = (await post(coord, `/api/infants/${infant.id}/visits`, visit(clinic.people.nurse.id))).body;
    const moved = (await coord.patch(`/api/visits/${v.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: v.rowVersion, date: future(4), time: '14:30' }).expect(200)).body;
    expect(moved).toMatchObject({ date: future(4), time: '14:30', rowVersion: 2 });
    await coord.patch(`/api/visits/${v.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: 1, time: '15:00' }).expect(409);
    const cancelled = (await post(coord, `/api/visits/${v.id}/cancel`, { reason: 'Family away' }).expect(200)).body;
    expect(cancelled).toMatchObject({ status: 'cancelled', cancelReason: 'Family away' });
    await post(coord, `/api/visits/${v.id}/cancel`, { reason: 'again' }).expect(409);
  });

  it('when input is bad, then 400 per field', async () => {
    const { clinic, coord, infant } = await baby();
    const res = await post(coord, `/api/infants/${infant.id}/visits`, visit(clinic.people.family.id, { time: '25:00', durationMinutes: 1, kind: 'party' })).expect(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['durationMinutes', 'kind', 'time']);
    const notStaff = await post(coord, `/api/infants/${infant.id}/visits`, visit(clinic.people.family.id)).expect(400);
    expect(notStaff.body.error.details.staffId).toBeDefined();
    await post(coord, `/api/infants/${infant.id}/visits`, visit(clinic.people.nurse.id, { date: '2020-01-01' })).expect(400);
  });

  it('when the family, another nurse or another programme acts, then 403 / 404; the family can read its own visits', async () => {
    const { clinic, coord, infant } = await baby();
    await post(coord, `/api/infants/${infant.id}/visits`, visit(clinic.people.nurse.id)).expect(201);
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    await post(family, `/api/infants/${infant.id}/visits`, visit(clinic.people.nurse.id)).expect(403);
    expect((await family.get(`/api/infants/${infant.id}/visits`).expect(200)).body.items).toHaveLength(1);
    const otherNurse = await makeUser(ctx.deps, clinic.programme.id, 'nurse');
    const a = await signedInAgent(ctx.app, otherNurse.email);
    await post(a, `/api/infants/${infant.id}/visits`, visit(otherNurse.id)).expect(404);
    const other = await makeClinic(ctx.deps);
    const outsider = await signedInAgent(ctx.app, other.people.coordinator.email);
    await outsider.get(`/api/infants/${infant.id}/visits`).expect(404);
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    await post(nurse, `/api/infants/${infant.id}/visits`, visit(clinic.people.nurse.id, { kind: 'clinic_review' })).expect(201);
  });
});
