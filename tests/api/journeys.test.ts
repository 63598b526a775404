import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { approvedBaby, post } from '../helpers/approved-baby';
import { journeyListSchema, journeyResponseSchema } from '@shared/schemas/journeys';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
const flight = (over: Record<string, unknown> = {}) => ({ mode: 'flight', destinationName: 'Visit to grandparents', departOn: day(10), returnOn: day(17), hoursAway: 9, ...over });
const road = (over: Record<string, unknown> = {}) => ({ mode: 'road', destinationName: 'High Saddle', destinationElevationM: 2350, departOn: day(5), returnOn: day(6), hoursAway: 30, ...over });
const baby = () => approvedBaby(ctx.deps, ctx.app);

describe('asking for a journey check', () => {
  it('when the family asks for a flight, then it waits for the consultant, the family sees no numbers, staff see the working, and it is audited', async () => {
    const { infant, family, coord, clinic } = await baby();
    const res = await post(family, `/api/infants/${infant.id}/journeys`, flight()).expect(201);
    expect(journeyResponseSchema.safeParse(res.body).success).toBe(true);
    const j = res.body.journey;
    expect(j).toMatchObject({ infantId: infant.id, status: 'waiting', plan: null, decision: null, rowVersion: 1, requestedBy: { id: clinic.people.family.id } });
    // No cabin altitude given: the 8,000 ft maximum of 14 CFR 25.841(a) is planned for (docs/clinical-sources.md §4.4).
    expect(j.request).toMatchObject({ mode: 'flight', cabinAltitudeFt: 8000, hoursAway: 9, destinationElevationM: null, notes: null });

    const staff = (await coord.get(`/api/journeys/${j.id}`).expect(200)).body.journey;
    expect(staff.plan.destination.elevationM).toBeCloseTo(2438.4, 6);
    expect(staff.plan.working.conversions.length).toBeGreaterThan(0);
    expect(staff.plan.periods.every((p: { flowLpm: number }) => p.flowLpm > 0)).toBe(true);
    expect(staff.plan.cautions.join(' ')).toMatch(/hypoxic challenge test/);
    expect(staff.plan.cylinders.map((c: { cylinderId: string }) => c.cylinderId)).toEqual(['small-portable', 'large-home']);

    const [row] = await ctx.deps.ds.query(`SELECT status, mode, hours_away, plan->>'exceedsCannula' AS exceeds FROM journeys WHERE id = $1`, [j.id]);
    expect(row).toMatchObject({ status: 'waiting', mode: 'flight', hours_away: 9, exceeds: 'false' });
    const audit = await ctx.deps.repos.audit.listForEntity('infant', infant.id);
    expect(audit.find((a) => a.action === 'journey.requested')?.details).toMatchObject({ journeyId: j.id, mode: 'flight' });
  });

  it('when the coordinator asks for a road trip, then the flow there is above the home flow and the staff list has it', async () => {
    const { infant, coord, rx } = await baby();
    const j = (await post(coord, `/api/infants/${infant.id}/journeys`, road()).expect(201)).body.journey;
    expect(j.plan.destination).toMatchObject({ kind: 'place', elevationM: 2350 });
    expect(j.plan.periods[0].flowLpm).toBeGreaterThan(rx.approvedFlowLpm);
    const list = (await coord.get(`/api/infants/${infant.id}/journeys`).expect(200)).body;
    expect(journeyListSchema.safeParse(list).success).toBe(true);
    expect(list.items.map((i: { id: string }) => i.id)).toEqual([j.id]);
  });

  it('when the baby has no approved setting yet, then 409 and nothing is stored', async () => {
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const infant = (await post(coord, '/api/infants', enrolmentBody(clinic)).expect(201)).body;
    await post(coord, `/api/infants/${infant.id}/journeys`, road()).expect(409);
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM journeys WHERE infant_id = $1`, [infant.id]);
    expect(n).toBe(0);
  });
});

describe('deciding', () => {
  it('when the consultant approves, then the family sees the flow, but not the working; a second decision gets 409', async () => {
    const { infant, family, consultant, coord } = await baby();
    const first = (await post(family, `/api/infants/${infant.id}/journeys`, flight()).expect(201)).body.journey;
    const second = (await post(coord, `/api/infants/${infant.id}/journeys`, road()).expect(201)).body.journey;
    const waiting = (await consultant.get('/api/journeys/waiting').expect(200)).body.items.map((i: { id: string }) => i.id);
    expect(waiting).toEqual([first.id, second.id]); // oldest first
    expect((await coord.get('/api/journeys/waiting').expect(200)).body.items).toHaveLength(2);

    const res = await post(consultant, `/api/journeys/${first.id}/decision`, { decision: 'approve', rowVersion: 1, reason: 'Fine to fly' }).expect(200);
    expect(res.body.journey).toMatchObject({ status: 'approved', rowVersion: 2, decision: { outcome: 'approved', reason: 'Fine to fly' } });
    await post(consultant, `/api/journeys/${first.id}/decision`, { decision: 'decline', reason: 'Changed my mind', rowVersion: 2 }).expect(409);

    const seen = (await family.get(`/api/journeys/${first.id}`).expect(200)).body.journey;
    expect(seen.plan.periods[0].flowLpm).toBe(res.body.journey.plan.periods[0].flowLpm);
    expect(seen.plan.cylinders[0].count).toBeGreaterThan(0);
    expect(seen.plan.working).toBeUndefined();
    expect(seen.plan.warnings).toBeUndefined();
    expect(seen.decision).toMatchObject({ outcome: 'approved', reason: null });
    const mine = (await family.get(`/api/infants/${infant.id}/journeys`).expect(200)).body.items;
    expect(mine.find((i: { id: string }) => i.id === second.id).plan).toBeNull(); // still waiting: no numbers
    expect((await consultant.get('/api/journeys/waiting').expect(200)).body.items.map((i: { id: string }) => i.id)).toEqual([second.id]);
    const audit = await ctx.deps.repos.audit.listForEntity('infant', infant.id);
    expect(audit.find((a) => a.action === 'journey.approved')?.details).toMatchObject({ journeyId: first.id, reason: 'Fine to fly' });
  });

  it('when the consultant declines, then a reason is needed; a stale version gets 409; the family sees the status only', async () => {
    const { infant, family, consultant } = await baby();
    const j = (await post(family, `/api/infants/${infant.id}/journeys`, road()).expect(201)).body.journey;
    const noReason = await post(consultant, `/api/journeys/${j.id}/decision`, { decision: 'decline', rowVersion: 1 }).expect(400);
    expect(Object.keys(noReason.body.error.details)).toEqual(['reason']);
    await post(consultant, `/api/journeys/${j.id}/decision`, { decision: 'decline', reason: 'Too high', rowVersion: 7 }).expect(409);
    const res = await post(consultant, `/api/journeys/${j.id}/decision`, { decision: 'decline', reason: 'Too high for now', rowVersion: 1 }).expect(200);
    expect(res.body.journey).toMatchObject({ status: 'declined', decision: { outcome: 'declined', reason: 'Too high for now' } });
    const seen = (await family.get(`/api/journeys/${j.id}`).expect(200)).body.journey;
    expect(seen).toMatchObject({ status: 'declined', plan: null, decision: { outcome: 'declined', reason: null } });
  });

  it('when two consultants decide at once, then one wins and the other gets 409', async () => {
    const { infant, family, consultant, clinic } = await baby();
    const j = (await post(family, `/api/infants/${infant.id}/journeys`, road()).expect(201)).body.journey;
    const other = await signedInAgent(ctx.app, (await makeUser(ctx.deps, clinic.programme.id, 'consultant')).email);
    const results = await Promise.all([
      post(consultant, `/api/journeys/${j.id}/decision`, { decision: 'approve', rowVersion: 1 }),
      post(other, `/api/journeys/${j.id}/decision`, { decision: 'decline', reason: 'No', rowVersion: 1 }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
  });

  it('when the plan needs more than the cannula gives, then approving it needs a reason', async () => {
    // 2 kg on 1.5 L/min of 100 % at sea level cannot be matched at an 8,000 ft cabin (target FiO2 above 1; computed).
    const { infant, family, consultant } = await approvedBaby(ctx.deps, ctx.app, { weightKg: 2, flowLpm: 1.5, homeElevationM: 95 });
    const j = (await post(family, `/api/infants/${infant.id}/journeys`, flight()).expect(201)).body.journey;
    const staff = (await consultant.get(`/api/journeys/${j.id}`).expect(200)).body.journey;
    expect(staff.plan.exceedsCannula).toBe(true);
    const res = await post(consultant, `/api/journeys/${j.id}/decision`, { decision: 'approve', rowVersion: 1 }).expect(400);
    expect(res.body.error.details.reason).toBeDefined();
  });
});

describe('bad input (400 per field)', () => {
  it('when the request is wrong, then every bad field is named and nothing is stored', async () => {
    const { infant, coord, consultant } = await baby();
    const bad = await post(coord, `/api/infants/${infant.id}/journeys`, { mode: 'boat', destinationName: '', departOn: '2026-13-01', returnOn: day(5), hoursAway: 0, extra: 1 }).expect(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['_', 'departOn', 'destinationName', 'hoursAway', 'mode']);
    const roadless = await post(coord, `/api/infants/${infant.id}/journeys`, road({ destinationElevationM: undefined, cabinAltitudeFt: 6000 })).expect(400);
    expect(Object.keys(roadless.body.error.details).sort()).toEqual(['cabinAltitudeFt', 'destinationElevationM']);
    const backwards = await post(coord, `/api/infants/${infant.id}/journeys`, flight({ departOn: day(9), returnOn: day(8), cabinAltitudeFt: 9000 })).expect(400);
    expect(Object.keys(backwards.body.error.details).sort()).toEqual(['cabinAltitudeFt', 'returnOn']);
    const tooLong = await post(coord, `/api/infants/${infant.id}/journeys`, road({ departOn: day(5), returnOn: day(5), hoursAway: 25 })).expect(400);
    expect(Object.keys(tooLong.body.error.details)).toEqual(['hoursAway']);
    const past = await post(coord, `/api/infants/${infant.id}/journeys`, road({ departOn: day(-3), returnOn: day(-2), hoursAway: 5 })).expect(400);
    expect(Object.keys(past.body.error.details).sort()).toEqual(['departOn', 'returnOn']);
    await post(coord, '/api/infants/not-an-id/journeys', road()).expect(400);
    await coord.get('/api/infants/not-an-id/journeys').expect(400);
    await coord.get('/api/journeys/not-an-id').expect(400);
    const j = (await post(coord, `/api/infants/${infant.id}/journeys`, road()).expect(201)).body.journey;
    const badDecision = await post(consultant, `/api/journeys/${j.id}/decision`, { decision: 'maybe' }).expect(400);
    expect(Object.keys(badDecision.body.error.details).sort()).toEqual(['decision', 'rowVersion']);
    await post(consultant, '/api/journeys/not-an-id/decision', { decision: 'approve', rowVersion: 1 }).expect(400);
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM journeys WHERE infant_id = $1`, [infant.id]);
    expect(n).toBe(1);
  });
});

describe('who may do what', () => {
  it('when signed out, then every route answers 401', async () => {
    const { infant, coord } = await baby();
    const j = (await post(coord, `/api/infants/${infant.id}/journeys`, road()).expect(201)).body.journey;
    const anon = await anonymousAgent(ctx.app);
    await post(anon, `/api/infants/${infant.id}/journeys`, road()).expect(401);
    await anon.get(`/api/infants/${infant.id}/journeys`).expect(401);
    await anon.get('/api/journeys/waiting').expect(401);
    await anon.get(`/api/journeys/${j.id}`).expect(401);
    await post(anon, `/api/journeys/${j.id}/decision`, { decision: 'approve', rowVersion: 1 }).expect(401);
  });

  it('when a role lacks the right, then 403', async () => {
    const { infant, coord, family, clinic } = await baby();
    const j = (await post(coord, `/api/infants/${infant.id}/journeys`, road()).expect(201)).body.journey;
    for (const role of ['nurse', 'consultant', 'admin'] as const) {
      const a = await signedInAgent(ctx.app, clinic.people[role].email);
      await post(a, `/api/infants/${infant.id}/journeys`, road()).expect(403);
    }
    for (const a of [family, coord, await signedInAgent(ctx.app, clinic.people.nurse.email), await signedInAgent(ctx.app, clinic.people.admin.email)]) {
      await post(a, `/api/journeys/${j.id}/decision`, { decision: 'approve', rowVersion: 1 }).expect(403);
    }
    for (const role of ['family', 'nurse', 'admin'] as const) {
      const a = role === 'family' ? family : await signedInAgent(ctx.app, clinic.people[role].email);
      await a.get('/api/journeys/waiting').expect(403);
    }
  });

  it("when another family, another nurse or another programme asks, then 404: a family never reads another family's journey", async () => {
    const { infant, coord, family, clinic } = await baby();
    const j = (await post(family, `/api/infants/${infant.id}/journeys`, road()).expect(201)).body.journey;
    // A second family of the same programme, with its own baby.
    const otherParent = await makeUser(ctx.deps, clinic.programme.id, 'family');
    await post(coord, '/api/infants', enrolmentBody(clinic, { familyEmail: otherParent.email })).expect(201);
    const other = await signedInAgent(ctx.app, otherParent.email);
    await other.get(`/api/journeys/${j.id}`).expect(404);
    await other.get(`/api/infants/${infant.id}/journeys`).expect(404);
    await post(other, `/api/infants/${infant.id}/journeys`, road()).expect(404);
    // A nurse without this baby on their caseload; the baby's own nurse may read.
    const otherNurse = await signedInAgent(ctx.app, (await makeUser(ctx.deps, clinic.programme.id, 'nurse')).email);
    await otherNurse.get(`/api/journeys/${j.id}`).expect(404);
    await otherNurse.get(`/api/infants/${infant.id}/journeys`).expect(404);
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    expect((await nurse.get(`/api/journeys/${j.id}`).expect(200)).body.journey.plan).not.toBeNull();
    // Another programme sees nothing, and its consultant cannot decide.
    const elsewhere = await makeClinic(ctx.deps);
    const outsider = await signedInAgent(ctx.app, elsewhere.people.consultant.email);
    await outsider.get(`/api/journeys/${j.id}`).expect(404);
    await post(outsider, `/api/journeys/${j.id}/decision`, { decision: 'approve', rowVersion: 1 }).expect(404);
    expect((await outsider.get('/api/journeys/waiting').expect(200)).body.items).toEqual([]);
    const outCoord = await signedInAgent(ctx.app, elsewhere.people.coordinator.email);
    await post(outCoord, `/api/infants/${infant.id}/journeys`, road()).expect(404);
    await coord.get('/api/journeys/00000000-0000-4000-8000-000000000000').expect(404);
    const [{ status }] = await ctx.deps.ds.query(`SELECT status FROM journeys WHERE id = $1`, [j.id]);
    expect(status).toBe('waiting');
  });
});

describe('for the day-before reminder', () => {
  it('when a journey is approved, then it is listed by its departure date', async () => {
    const { infant, family, consultant } = await baby();
    const j = (await post(family, `/api/infants/${infant.id}/journeys`, road({ departOn: day(12), returnOn: day(13) })).expect(201)).body.journey;
    expect((await ctx.deps.repos.journeys.approvedDepartingOn(day(12))).map((r) => r.id)).not.toContain(j.id);
    await post(consultant, `/api/journeys/${j.id}/decision`, { decision: 'approve', rowVersion: 1 }).expect(200);
    expect((await ctx.deps.repos.journeys.approvedDepartingOn(day(12))).map((r) => r.id)).toContain(j.id);
  });
});
