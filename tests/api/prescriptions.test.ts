import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/roles';
import { convertPrescription } from '@shared/clinical/conversion';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic, runPendingConversions } from '../helpers/infants';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

async function proposal(overrides = {}) {
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const body = enrolmentBody(clinic, { familyEmail: clinic.people.family.email, ...overrides });
  const infant = (await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(body).expect(201)).body;
  await runPendingConversions(ctx.deps, infant.id);
  const consultant = await signedInAgent(ctx.app, clinic.people.consultant.email);
  const [rx] = (await consultant.get(`/api/infants/${infant.id}/prescriptions`).expect(200)).body.items;
  return { clinic, infant, rx, consultant, body };
}

describe('the computed proposal', () => {
  it('when the worker step has run, then the stored proposal equals the shared conversion of the stored input, with working and model', async () => {
    const { rx, clinic } = await proposal();
    expect(rx.status).toBe('proposed');
    const expected = convertPrescription({
      weightKg: 3, flowLpm: 0.25, sourceO2Percent: 100, homeSourceO2Percent: 100, hospital: { elevationM: clinic.site.elevationM }, home: { elevationM: 1780 },
    });
    expect(rx.proposedFlowLpm).toBeCloseTo(expected.home.roundedFlowLpm!, 6);
    expect(rx.proposedFlowLpm).toBeGreaterThanOrEqual(rx.requiredFlowLpm);
    expect(rx.conversion.working.length).toBeGreaterThan(8);
    expect(rx.conversion.model.version).toBe(expected.model.version);
  });

  it('when the sign-off queue is read, then it lists proposals oldest first with the baby and setting', async () => {
    const first = await proposal();
    const coord = await signedInAgent(ctx.app, first.clinic.people.coordinator.email);
    const second = (await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(enrolmentBody(first.clinic, { homeElevationM: 2350 })).expect(201)).body;
    await runPendingConversions(ctx.deps, second.id);
    const q = (await first.consultant.get('/api/prescriptions/queue').expect(200)).body.items;
    expect(q.map((i: { infantId: string }) => i.infantId)).toEqual([first.infant.id, second.id]);
    expect(q[0]).toMatchObject({ homeElevationM: 1780, siteName: first.clinic.site.name, reason: 'enrolment', feasible: true });
    const nurse = await signedInAgent(ctx.app, first.clinic.people.nurse.email);
    await nurse.get('/api/prescriptions/queue').expect(403);
  });
});

describe('POST /api/prescriptions/:id/decision', () => {
  it('when the consultant approves as proposed, then it becomes the active plan and the family can see it', async () => {
    const { rx, consultant, infant, clinic } = await proposal();
    const res = await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'approve' }).expect(200);
    expect(res.body).toMatchObject({ status: 'active', approvedFlowLpm: rx.proposedFlowLpm, decidedBy: { id: clinic.people.consultant.id } });
    const stored = await ctx.deps.repos.infants.findByEnrolKey(clinic.programme.id, (await ctx.deps.repos.infants.findVisible(infant.id, { sql: '1=1', params: {} }))!.enrolKey);
    expect(stored?.status).toBe('on_oxygen');
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    const seen = (await family.get(`/api/infants/${infant.id}/prescriptions`).expect(200)).body.items;
    expect(seen.map((p: { status: string }) => p.status)).toEqual(['active']);
  });

  it('when a proposal is not yet approved, then the family sees no plan at all', async () => {
    const { infant, clinic } = await proposal();
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    expect((await family.get(`/api/infants/${infant.id}/prescriptions`).expect(200)).body.items).toEqual([]);
    expect((await family.get(`/api/infants/${infant.id}`).expect(200)).body.activeSetting).toBeNull();
  });

  it('when a different step is chosen, then a reason is required, and a step below the requirement says so', async () => {
    const { rx, consultant } = await proposal();
    // Two 0.025 L/min steps down from the rounded-up proposal lands under the requirement (0.55 → 0.5 < 0.506).
    const below = Math.round((rx.proposedFlowLpm - 0.05) * 1000) / 1000;
    expect(below).toBeLessThan(rx.requiredFlowLpm);
    const noReason = await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'approve', flowLpm: below }).expect(400);
    expect(noReason.body.error.details.reason[0]).toMatch(/below the required flow/);
    const notAStep = await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'approve', flowLpm: 0.333, reason: 'x' }).expect(400);
    expect(notAStep.body.error.details.flowLpm).toBeDefined();
    const ok = await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'approve', flowLpm: below, reason: 'Saturations stable on this flow in hospital' }).expect(200);
    expect(ok.body).toMatchObject({ approvedFlowLpm: below, decisionReason: 'Saturations stable on this flow in hospital' });
    const audit = await ctx.deps.repos.audit.listForEntity('infant', rx.infantId);
    expect(audit.find((a) => a.action === 'prescription.approved')?.details).toMatchObject({ approvedFlowLpm: below, reason: 'Saturations stable on this flow in hospital' });
  });

  it('when the consultant sends it back, then a reason is needed and the baby shows as sent back', async () => {
    const { rx, consultant, infant } = await proposal();
    await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'reject' }).expect(400);
    await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'reject', reason: 'Check elevation' }).expect(200);
    expect((await consultant.get(`/api/infants/${infant.id}`).expect(200)).body.status).toBe('sent_back');
  });

  it('when two consultants decide the same proposal at once, then one wins and the other gets 409', async () => {
    const { rx, consultant, clinic } = await proposal();
    const second = await makeUser(ctx.deps, clinic.programme.id, 'consultant');
    const other = await signedInAgent(ctx.app, second.email);
    const [a, b] = await Promise.all([
      consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'approve' }),
      other.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', other.csrf).send({ decision: 'reject', reason: 'No' }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM prescriptions WHERE infant_id = $1 AND status IN ('active','rejected')`, [rx.infantId]);
    expect(n).toBe(1);
  });

  it.each<[Role, number]>([['coordinator', 403], ['nurse', 403], ['admin', 403], ['family', 403]])('when a %s tries to decide, then %i', async (role, status) => {
    const { rx, clinic } = await proposal();
    const agent = await signedInAgent(ctx.app, clinic.people[role].email);
    await agent.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', agent.csrf).send({ decision: 'approve' }).expect(status);
  });

  it('when a consultant of another programme decides, then 404 and nothing changes', async () => {
    const { rx } = await proposal();
    const other = await makeClinic(ctx.deps);
    const outsider = await signedInAgent(ctx.app, other.people.consultant.email);
    await outsider.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', outsider.csrf).send({ decision: 'approve' }).expect(404);
    await outsider.get(`/api/prescriptions/${rx.id}`).expect(404);
    const [{ status }] = await ctx.deps.ds.query(`SELECT status FROM prescriptions WHERE id = $1`, [rx.id]);
    expect(status).toBe('proposed');
  });
});

describe('POST /api/conversions/preview', () => {
  const body = { weightKg: 3, flowLpm: 0.25, sourceO2Percent: 100, hospital: { elevationM: 0 }, home: { elevationM: 1800 } };

  it('when staff preview the worked example, then the flow is 0.526 L/min rounded up to 0.55 (docs/clinical-sources.md §2.4, computed from the wet rule and STOP-ROP)', async () => {
    const clinic = await makeClinic(ctx.deps);
    const agent = await signedInAgent(ctx.app, clinic.people.nurse.email);
    const res = await agent.post('/api/conversions/preview').set('X-CSRF-Token', agent.csrf).send(body).expect(200);
    expect(res.body.home.requiredFlowLpm).toBeCloseTo(0.526, 3);
    expect(res.body.home.roundedFlowLpm).toBeCloseTo(0.55, 9);
    expect(res.body.feasible).toBe(true);
  });

  it('when fields are out of range, then 400 per field; a family gets 403; signed out gets 401', async () => {
    const clinic = await makeClinic(ctx.deps);
    const agent = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const res = await agent.post('/api/conversions/preview').set('X-CSRF-Token', agent.csrf)
      .send({ ...body, weightKg: 0, flowLpm: 16, sourceO2Percent: 20, home: { pressureMmHg: 200 }, hospital: { elevationM: 7000 } }).expect(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['flowLpm', 'home.pressureMmHg', 'hospital.elevationM', 'sourceO2Percent', 'weightKg']);
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    await family.post('/api/conversions/preview').set('X-CSRF-Token', family.csrf).send(body).expect(403);
  });
});

describe('what a family receives', () => {
  it('when a family reads the approved plan, then the working, the input and staff reasons are left out', async () => {
    const { rx, consultant, infant, clinic } = await proposal();
    await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'approve', reason: 'Staff-only note' }).expect(200);
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    const [plan] = (await family.get(`/api/infants/${infant.id}/prescriptions`).expect(200)).body.items;
    expect(plan).toMatchObject({ status: 'active', approvedFlowLpm: rx.proposedFlowLpm, conversion: null, input: {}, decisionReason: null, requiredFlowLpm: null });
  });

  it('when a part of the day is set below the requirement, then a reason is required', async () => {
    const { rx, consultant } = await proposal();
    const res = await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf)
      .send({ decision: 'approve', periods: { awake: rx.proposedFlowLpm, asleep: rx.proposedFlowLpm, feeding: 0 } }).expect(400);
    expect(res.body.error.details['periods.feeding'][0]).toMatch(/below the required flow/);
  });
});
