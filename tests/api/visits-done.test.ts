import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Clock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic } from '../helpers/infants';

// The clock is the test's: visits are booked ahead of it, then it is moved on to when they take place.
let now = new Date('2026-12-01T09:00:00Z');
const clock: Clock = { now: () => now };
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock });
});
afterAll(() => ctx.close());

const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);

/** A baby whose family lives in London, with a home visit booked for 10:00 on 2 December 2026 (London = UTC then). */
async function bookedVisit() {
  now = new Date('2026-12-01T09:00:00Z');
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const infant = (await post(coord, '/api/infants', enrolmentBody(clinic, { familyEmail: clinic.people.family.email })).expect(201)).body;
  const visit = (await post(coord, `/api/infants/${infant.id}/visits`, {
    kind: 'home_visit', date: '2026-12-02', time: '10:00', durationMinutes: 45, staffId: clinic.people.nurse.id, purpose: 'Spot check and weight',
  }).expect(201)).body;
  expect(visit.startsAt).toBe('2026-12-02T10:00:00.000Z');
  return { clinic, coord, infant, visit };
}

describe('a visit marked done', () => {
  it('when the nurse marks the visit done after its time, then it is done, its unsent reminders are cancelled and the audit trail says so', async () => {
    const { clinic, infant, visit } = await bookedVisit();
    const scheduled = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM reminders WHERE visit_id = $1 AND status = 'scheduled'`, [visit.id]);
    expect(scheduled[0].n).toBeGreaterThan(0);
    now = new Date('2026-12-02T10:50:00Z');
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    const done = (await post(nurse, `/api/visits/${visit.id}/done`, { rowVersion: visit.rowVersion }).expect(200)).body;
    expect(done).toMatchObject({ id: visit.id, status: 'done', rowVersion: visit.rowVersion + 1 });
    const left = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM reminders WHERE visit_id = $1 AND status = 'scheduled'`, [visit.id]);
    expect(left[0].n).toBe(0);
    const audit = await ctx.deps.repos.audit.listForEntity('infant', infant.id);
    expect(audit.find((a) => a.action === 'visit.done')).toMatchObject({ actorId: clinic.people.nurse.id, details: { visitId: visit.id, date: '2026-12-02', time: '10:00' } });
    // The family's list shows it done.
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    expect((await family.get(`/api/infants/${infant.id}/visits`).expect(200)).body.items[0]).toMatchObject({ id: visit.id, status: 'done' });
  });

  it('when a visit is still to come, then it cannot be marked done until an hour before its time', async () => {
    const { coord, visit } = await bookedVisit();
    now = new Date('2026-12-02T08:59:00Z');
    const early = await post(coord, `/api/visits/${visit.id}/done`, { rowVersion: visit.rowVersion }).expect(409);
    expect(early.body.error.message).toMatch(/still to come/);
    now = new Date('2026-12-02T09:00:00Z');
    await post(coord, `/api/visits/${visit.id}/done`, { rowVersion: visit.rowVersion }).expect(200);
  });

  it('when the visit was changed meanwhile, is already done or was cancelled, then 409 and nothing changes', async () => {
    const { coord, visit } = await bookedVisit();
    const moved = (await coord.patch(`/api/visits/${visit.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: visit.rowVersion, time: '09:30' }).expect(200)).body;
    now = new Date('2026-12-02T11:00:00Z');
    await post(coord, `/api/visits/${visit.id}/done`, { rowVersion: visit.rowVersion }).expect(409);
    await post(coord, `/api/visits/${visit.id}/done`, { rowVersion: moved.rowVersion }).expect(200);
    const again = await post(coord, `/api/visits/${visit.id}/done`, { rowVersion: moved.rowVersion + 1 }).expect(409);
    expect(again.body.error.message).toMatch(/already done/);
    await post(coord, `/api/visits/${visit.id}/cancel`, { reason: 'Too late' }).expect(409);
    const other = await bookedVisit();
    await post(other.coord, `/api/visits/${other.visit.id}/cancel`, { reason: 'Family away' }).expect(200);
    now = new Date('2026-12-02T11:00:00Z');
    expect((await post(other.coord, `/api/visits/${other.visit.id}/done`, { rowVersion: other.visit.rowVersion + 1 }).expect(409)).body.error.message).toMatch(/already cancelled/);
  });

  it('when the body is bad, then 400 per field', async () => {
    const { coord, visit } = await bookedVisit();
    const res = await post(coord, `/api/visits/${visit.id}/done`, { rowVersion: 'one', extra: true }).expect(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(expect.arrayContaining(['rowVersion']));
    await post(coord, `/api/visits/not-an-id/done`, { rowVersion: 1 }).expect(400);
  });

  it('when the family, a nurse off the caseload or another programme tries, then 403 / 404 and the visit stays booked', async () => {
    const { clinic, coord, infant, visit } = await bookedVisit();
    now = new Date('2026-12-02T11:00:00Z');
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    await post(family, `/api/visits/${visit.id}/done`, { rowVersion: visit.rowVersion }).expect(403);
    const otherNurse = await makeUser(ctx.deps, clinic.programme.id, 'nurse');
    await post(await signedInAgent(ctx.app, otherNurse.email), `/api/visits/${visit.id}/done`, { rowVersion: visit.rowVersion }).expect(404);
    const elsewhere = await makeClinic(ctx.deps);
    await post(await signedInAgent(ctx.app, elsewhere.people.coordinator.email), `/api/visits/${visit.id}/done`, { rowVersion: visit.rowVersion }).expect(404);
    expect((await coord.get(`/api/infants/${infant.id}/visits`).expect(200)).body.items[0]).toMatchObject({ status: 'booked', rowVersion: visit.rowVersion });
  });
});
