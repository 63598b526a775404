import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Role } from '@shared/auth/roles';
import { isaPressureMmHg } from '@shared/clinical/pressure';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { enrolmentBody, makeClinic, runPendingConversions } from '../helpers/infants';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

async function enrolled(clinic: Awaited<ReturnType<typeof makeClinic>>, overrides = {}) {
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const res = await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(enrolmentBody(clinic, overrides)).expect(201);
  return { coord, infant: res.body };
}

describe('POST /api/infants', () => {
  it('when a coordinator enrols a baby, then the record, contacts, a preparing proposal and an audit entry are stored', async () => {
    const clinic = await makeClinic(ctx.deps);
    const { infant } = await enrolled(clinic);
    expect(infant).toMatchObject({ status: 'preparing', homeElevationM: 1780, weightKg: 3, activeSetting: null });
    // Stored pressure is the shared ISA function's value (checked against USSA-1976 in tests/shared); between the
    // 611.22 mmHg that docs/clinical-sources.md §2.3 lists for 1800 m and the 1500 m table value.
    expect(infant.homePressureMmHg).toBeCloseTo(isaPressureMmHg(1780), 2);
    expect(infant.homePressureMmHg).toBeGreaterThan(611.22);
    const rx = await ctx.deps.ds.query(`SELECT status, reason, version FROM prescriptions WHERE infant_id = $1`, [infant.id]);
    expect(rx).toEqual([{ status: 'preparing', reason: 'enrolment', version: 1 }]);
    const contacts = await ctx.deps.repos.contacts.listForInfant(infant.id);
    // Typed '+44 7700 900001', stored in E.164.
    expect(contacts.map((c) => c.mobile)).toEqual(['+447700900001']);
    const audit = await ctx.deps.repos.audit.listForEntity('infant', infant.id);
    expect(audit.map((a) => a.action).sort()).toEqual(['infant.enrolled', 'prescription.requested']);
  });

  it('when 0.32 kg is typed for 3.2 kg, then 422 asks to confirm and nothing is stored; once confirmed it is saved', async () => {
    // common practice: a weight under 1.0 kg at discharge home is rare enough to check (shared/clinical/weight-check.ts)
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const body = enrolmentBody(clinic, { weightKg: 0.32 });
    const res = await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(body).expect(422);
    expect(res.body.error).toMatchObject({ code: 'needs_confirmation', details: { 'baby.weightKg': [expect.stringMatching(/^0.32 kg is under 1 kg/)] } });
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM infants WHERE programme_id = $1`, [clinic.programme.id]);
    expect(n).toBe(0);
    await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send({ ...body, baby: { ...body.baby, weightConfirmed: true } }).expect(201);
    const tiny = await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(enrolmentBody(clinic, { weightKg: 0.05 })).expect(400);
    expect(tiny.body.error.details['baby.weightKg']).toEqual(['At least 0.3 kg']);
  });

  it('when the same form is submitted twice, then one baby and one proposal exist', async () => {
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const body = enrolmentBody(clinic);
    const [a, b] = await Promise.all([
      coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(body),
      coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(body),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body.id).toBe(b.body.id);
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM prescriptions WHERE infant_id = $1`, [a.body.id]);
    expect(n).toBe(1);
  });

  it('when fields are wrong, then 400 names each field and nothing is stored', async () => {
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const body = enrolmentBody(clinic);
    body.baby.weightKg = 0;
    body.baby.gestation.days = 9;
    body.home.location = { elevationM: 9000 };
    body.contacts[0]!.preferredChannel = 'email';
    body.contacts[0]!.email = undefined;
    const res = await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(body).expect(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['baby.gestation.days', 'baby.weightKg', 'contacts.0.email', 'home.location.elevationM']);
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM infants WHERE programme_id = $1`, [clinic.programme.id]);
    expect(n).toBe(0);
  });

  it('when the site, nurse or consultant is not of this programme, then 400 on those fields', async () => {
    const clinic = await makeClinic(ctx.deps);
    const other = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const body = enrolmentBody(clinic);
    body.hospital.siteId = other.site.id;
    body.care = { nurseId: other.people.nurse.id, consultantId: clinic.people.nurse.id };
    const res = await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(body).expect(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['care.consultantId', 'care.nurseId', 'hospital.siteId']);
  });

  it.each<[Role, number]>([['admin', 403], ['nurse', 403], ['consultant', 403], ['family', 403]])('when a %s tries to enrol, then %i', async (role, status) => {
    const clinic = await makeClinic(ctx.deps);
    const agent = await signedInAgent(ctx.app, clinic.people[role].email);
    await agent.post('/api/infants').set('X-CSRF-Token', agent.csrf).send(enrolmentBody(clinic)).expect(status);
  });

  it('when signed out, then 401', async () => {
    const agent = request.agent(ctx.app);
    const { body } = await agent.get('/api/session');
    await agent.post('/api/infants').set('X-CSRF-Token', body.csrfToken).send({}).expect(401);
  });
});

describe('GET /api/infants and /api/infants/:id', () => {
  it('when a nurse lists, then only their caseload comes back; programme scope is refused', async () => {
    const clinic = await makeClinic(ctx.deps);
    const { infant } = await enrolled(clinic);
    const otherNurse = await (await import('../helpers/factories')).makeUser(ctx.deps, clinic.programme.id, 'nurse');
    const mine = await signedInAgent(ctx.app, clinic.people.nurse.email);
    expect((await mine.get('/api/infants').expect(200)).body.items.map((i: { id: string }) => i.id)).toEqual([infant.id]);
    const theirs = await signedInAgent(ctx.app, otherNurse.email);
    expect((await theirs.get('/api/infants').expect(200)).body.total).toBe(0);
    await theirs.get(`/api/infants/${infant.id}`).expect(404);
    await theirs.get('/api/infants?scope=programme').expect(403);
  });

  it('when listing with sort, filter and paging, then the database does it and totals are right', async () => {
    const clinic = await makeClinic(ctx.deps);
    for (const h of [40, 2350, 610]) await enrolled(clinic, { homeElevationM: h });
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const res = await coord.get('/api/infants?sort=-elevation&pageSize=2').expect(200);
    expect(res.body.total).toBe(3);
    expect(res.body.items.map((i: { homeElevationM: number }) => i.homeElevationM)).toEqual([2350, 610]);
    const page2 = await coord.get('/api/infants?sort=-elevation&pageSize=2&page=2').expect(200);
    expect(page2.body.items.map((i: { homeElevationM: number }) => i.homeElevationM)).toEqual([40]);
    expect((await coord.get('/api/infants?status=on_oxygen').expect(200)).body.total).toBe(0);
    await coord.get('/api/infants?sort=weight').expect(400);
  });

  it('when another programme or another family asks for a baby, then 404 (the record is not revealed)', async () => {
    const clinic = await makeClinic(ctx.deps);
    const other = await makeClinic(ctx.deps);
    const { infant } = await enrolled(clinic, { familyEmail: clinic.people.family.email });
    const { infant: otherInfant } = await enrolled(clinic, { familyEmail: 'someone-else@test.example' });
    const outsider = await signedInAgent(ctx.app, other.people.coordinator.email);
    await outsider.get(`/api/infants/${infant.id}`).expect(404);
    expect((await outsider.get('/api/infants').expect(200)).body.items.some((i: { id: string }) => i.id === infant.id)).toBe(false);
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    expect((await family.get('/api/infants').expect(200)).body.items.map((i: { id: string }) => i.id)).toEqual([infant.id]);
    await family.get(`/api/infants/${infant.id}`).expect(200);
    await family.get(`/api/infants/${otherInfant.id}`).expect(404);
    await family.get(`/api/infants/${otherInfant.id}/prescriptions`).expect(404);
    await family.get(`/api/infants/${infant.id}/audit`).expect(403);
    await family.get('/api/infants/not-a-uuid').expect(400);
  });
});

describe('PATCH /api/infants/:id', () => {
  it('when the weight changes after approval, then a growth-drift flag and a new proposal appear, and the change is audited', async () => {
    const clinic = await makeClinic(ctx.deps);
    const { coord, infant } = await enrolled(clinic, { weightKg: 2, flowLpm: 0.25 });
    await runPendingConversions(ctx.deps, infant.id);
    const consultant = await signedInAgent(ctx.app, clinic.people.consultant.email);
    const [rx] = (await consultant.get(`/api/infants/${infant.id}/prescriptions`).expect(200)).body.items;
    await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'approve' }).expect(200);
    const before = (await coord.get(`/api/infants/${infant.id}`).expect(200)).body;
    const unconfirmed = await coord.patch(`/api/infants/${infant.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: before.rowVersion, weightKg: 3.2, weightDate: '2026-11-28' }).expect(422);
    // 2 → 3.2 kg is a 60 % change: the coordinator must confirm it (common practice: > 20 % within 14 days)
    expect(unconfirmed.body.error).toMatchObject({ code: 'needs_confirmation', details: { weightKg: [expect.stringMatching(/60 % more than 2 kg/)] } });
    const res = await coord.patch(`/api/infants/${infant.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: before.rowVersion, weightKg: 3.2, weightDate: '2026-11-28', weightConfirmed: true }).expect(200);
    expect(res.body.flags).toEqual(expect.arrayContaining(['growth_drift', 'new_setting_waiting']));
    expect(res.body.status).toBe('on_oxygen');
    const versions = (await coord.get(`/api/infants/${infant.id}/prescriptions`).expect(200)).body.items;
    expect(versions.map((v: { status: string; reason: string }) => `${v.status}:${v.reason}`)).toEqual(['preparing:weight', 'active:enrolment']);
    const audit = await ctx.deps.repos.audit.listForEntity('infant', infant.id);
    const change = audit.find((a) => a.action === 'infant.updated');
    expect(change?.details).toMatchObject({ changes: { weightKg: { from: 2, to: 3.2 } } });
    await coord.patch(`/api/infants/${infant.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: before.rowVersion, weightKg: 3.3, weightDate: '2026-11-29' }).expect(409);
  });

  it('when a nurse or consultant tries to edit, then 403', async () => {
    const clinic = await makeClinic(ctx.deps);
    const { infant } = await enrolled(clinic);
    for (const role of ['nurse', 'consultant'] as const) {
      const a = await signedInAgent(ctx.app, clinic.people[role].email);
      await a.patch(`/api/infants/${infant.id}`).set('X-CSRF-Token', a.csrf).send({ rowVersion: 1, nurseId: clinic.people.nurse.id }).expect(403);
    }
  });
});
