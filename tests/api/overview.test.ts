import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { adminOverviewSchema, consultantOverviewSchema, coordinatorOverviewSchema } from '@shared/schemas/overview';
import { fixedClock } from '../../server/lib/clock';
import { anonymousAgent, signedInAgent } from '../helpers/agents';
import { post } from '../helpers/approved-baby';
import { makeUser } from '../helpers/factories';
import { overviewClinic } from '../helpers/overview';
import { insertReminder } from '../helpers/reminders';
import { createTestContext, type TestContext } from '../helpers/test-app';

// Wednesday 2 December 2026, noon in London (GMT): "this week" began on Monday 30 November at 00:00.
const NOW = '2026-12-02T12:00:00.000Z';
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
});
afterAll(() => ctx.close());

const months = (counts: Record<string, number>) =>
  ['2026-01', '2026-02', '2026-03', '2026-04', '2026-05', '2026-06', '2026-07', '2026-08', '2026-09', '2026-10', '2026-11', '2026-12']
    .map((month) => ({ month, count: counts[month] ?? 0 }));

/** Rows of every kind the overviews count, in a programme whose figures must never show up in another's. */
async function otherProgrammeNoise() {
  const other = await overviewClinic(ctx.deps, ctx.app);
  const waiting = await other.proposed();
  await other.createdAt('prescriptions', waiting.rxId, '2026-10-01T08:00:00Z');
  const { infant, rxId } = await other.approved();
  await other.decidedAt(rxId, '2026-03-10T10:00:00Z');
  await other.journey(infant.id);
  await other.check(infant.id, 'overdue', '2026-11-20T09:00:00Z');
  await insertReminder(ctx.deps, { programmeId: other.clinic.programme.id, infantId: infant.id, status: 'failed', sendAt: new Date('2026-12-01T09:00:00Z') });
  await insertReminder(ctx.deps, { programmeId: other.clinic.programme.id, infantId: infant.id, status: 'sent', sendAt: new Date('2026-12-01T09:00:00Z') });
  await makeUser(ctx.deps, other.clinic.programme.id, 'nurse');
  return other;
}

describe('the coordinator overview', () => {
  it('when the programme has babies in several states, then each figure counts exactly its own rows and none of another programme', async () => {
    await otherProgrammeNoise();
    const p = await overviewClinic(ctx.deps, ctx.app);
    await p.enrolled(); // preparing
    const waiting = await p.proposed(); // awaiting sign-off
    await p.createdAt('prescriptions', waiting.rxId, '2026-11-28T09:00:00Z');
    const atHome = await p.approved(); // on oxygen since late August
    await p.decidedAt(atHome.rxId, '2026-08-25T10:00:00Z');
    const off = await p.approved();
    // 23:30 on 31 May in UTC is already 1 June in London (BST): the month is the programme's.
    await p.decidedAt(off.rxId, '2026-05-31T23:30:00Z');
    await p.cameOffOxygen(off.infant.id, '2026-08-20T10:00:00Z');

    await p.check(atHome.infant.id, 'planned', '2026-12-02T11:59:00Z'); // due a minute ago, not yet marked by the daily run
    await p.check(atHome.infant.id, 'overdue', '2026-11-25T09:00:00Z');
    await p.check(off.infant.id, 'overdue', '2026-11-30T09:00:00Z');
    await p.check(off.infant.id, 'planned', '2026-12-02T12:01:00Z'); // due in a minute
    await p.check(off.infant.id, 'done', '2026-11-20T09:00:00Z');
    await p.check(off.infant.id, 'cancelled', '2026-11-21T09:00:00Z');

    const firstJourney = await p.journey(atHome.infant.id);
    await p.createdAt('journeys', firstJourney.id, '2026-11-29T15:00:00Z');
    await p.journey(atHome.infant.id);

    const programmeId = p.clinic.programme.id;
    for (const status of ['failed', 'failed', 'unknown', 'sent', 'scheduled', 'skipped'] as const) {
      await insertReminder(ctx.deps, { programmeId, infantId: atHome.infant.id, status });
    }

    const res = await p.coord.get('/api/overview').expect(200);
    const body = coordinatorOverviewSchema.parse(res.body);
    expect(body.asOf).toBe(NOW);
    expect(Object.fromEntries(body.babiesByStatus.map((s) => [s.status, s.count]))).toEqual({
      preparing: 1, awaiting_signoff: 1, sent_back: 0, on_oxygen: 1, stepping_down: 0, off_oxygen: 1, left_programme: 0,
    });
    expect(body.signOff).toEqual({ count: 1, oldestSince: '2026-11-28T09:00:00.000Z' });
    expect(body.overdueChecks).toEqual({ count: 3, babies: 2 });
    expect(body.messagesNeedingAction).toEqual({ failed: 2, unknown: 1 });
    expect(body.journeysWaiting.count).toBe(2);
    expect(body.journeysWaiting.oldestSince).toBe('2026-11-29T15:00:00.000Z');
    expect(body.journeysWaiting.oldest.map((j) => j.id)[0]).toBe(firstJourney.id);
    expect(body.journeysWaiting.oldest[0]).toMatchObject({ destinationName: 'High Saddle' });
    // June–August: the baby who came off oxygen on 20 August; from 25 August the baby at home; August has both.
    expect(body.onOxygenByMonth).toEqual(months({ '2026-06': 1, '2026-07': 1, '2026-08': 2, '2026-09': 1, '2026-10': 1, '2026-11': 1, '2026-12': 1 }));
  });

  it('when a programme has nothing yet, then every figure is zero and the months are still the last twelve', async () => {
    const p = await overviewClinic(ctx.deps, ctx.app);
    const body = coordinatorOverviewSchema.parse((await p.coord.get('/api/overview').expect(200)).body);
    expect(body.babiesByStatus.every((s) => s.count === 0)).toBe(true);
    expect(body.signOff).toEqual({ count: 0, oldestSince: null });
    expect(body.journeysWaiting).toEqual({ count: 0, oldestSince: null, oldest: [] });
    expect(body.onOxygenByMonth).toEqual(months({}));
  });
});

describe('the admin overview', () => {
  it('when people, settings and messages exist, then it counts people by role, names the settings version and this week’s messages only', async () => {
    await otherProgrammeNoise();
    const p = await overviewClinic(ctx.deps, ctx.app);
    const programmeId = p.clinic.programme.id;
    await makeUser(ctx.deps, programmeId, 'nurse');
    await makeUser(ctx.deps, programmeId, 'nurse');
    await makeUser(ctx.deps, programmeId, 'coordinator', { disabled: true });
    const admin = await signedInAgent(ctx.app, p.clinic.people.admin.email);

    const before = adminOverviewSchema.parse((await admin.get('/api/overview').expect(200)).body);
    expect(before.policy).toEqual({ version: 0, savedAt: null });

    const current = await ctx.deps.repos.policies.current(programmeId);
    await ctx.deps.repos.policies.insertVersion(programmeId, 1, current.settings, p.clinic.people.admin.id);
    const [{ created_at: savedAt }] = await ctx.deps.ds.query(`SELECT created_at FROM programme_policies WHERE programme_id = $1 AND version = 1`, [programmeId]);
    const at = (iso: string) => new Date(iso);
    await insertReminder(ctx.deps, { programmeId, status: 'sent', sendAt: at('2026-11-30T00:30:00Z') });
    await insertReminder(ctx.deps, { programmeId, status: 'sent', sendAt: at('2026-12-02T08:00:00Z') });
    await insertReminder(ctx.deps, { programmeId, status: 'sent', sendAt: at('2026-11-29T23:30:00Z') }); // Sunday: last week
    await insertReminder(ctx.deps, { programmeId, status: 'failed', sendAt: at('2026-12-01T09:00:00Z') });
    await insertReminder(ctx.deps, { programmeId, status: 'failed', sendAt: at('2026-11-27T09:00:00Z') }); // last week
    await insertReminder(ctx.deps, { programmeId, status: 'unknown', sendAt: at('2026-12-02T10:00:00Z') });

    const body = adminOverviewSchema.parse((await admin.get('/api/overview').expect(200)).body);
    expect(body.people).toEqual([
      { role: 'admin', active: 1, disabled: 0 },
      { role: 'coordinator', active: 1, disabled: 1 },
      { role: 'nurse', active: 3, disabled: 0 },
      { role: 'consultant', active: 1, disabled: 0 },
      { role: 'family', active: 1, disabled: 0 },
    ]);
    expect(body.policy).toEqual({ version: 1, savedAt: new Date(savedAt).toISOString() });
    expect(body.messagesThisWeek).toEqual({ since: '2026-11-30T00:00:00.000Z', sent: 2, failed: 1, unknown: 1 });
    expect(body.onOxygenByMonth).toHaveLength(12);
  });
});

describe('the consultant overview', () => {
  it('when proposals, journey checks and step downs wait, then it counts both kinds and names the step downs asked for against a rule', async () => {
    await otherProgrammeNoise();
    const p = await overviewClinic(ctx.deps, ctx.app);
    const first = await p.proposed();
    await p.createdAt('prescriptions', first.rxId, '2026-11-26T08:00:00Z');
    const stepping = await p.approved();
    // Just approved, so the time-on-setting rule at least is unmet: the request needs a reason to go ahead.
    const stepDown = (await post(p.coord, `/api/infants/${stepping.infant.id}/step-down-requests`, {
      reason: 'Settled on the last three visits', overrideReason: 'Family moving away; the consultant asked for it early',
    }).expect(201)).body;
    const allMet = await p.approved();
    const allMetDown = (await post(p.coord, `/api/infants/${allMet.infant.id}/step-down-requests`, {
      reason: 'Ready to come down', overrideReason: 'Checked with the consultant by phone this morning',
    }).expect(201)).body;
    // As if every rule had been met when it was asked for.
    await ctx.deps.ds.query(
      `UPDATE prescriptions SET evidence = jsonb_set(evidence, '{checks}', (SELECT jsonb_agg(c || '{"met": true}') FROM jsonb_array_elements(evidence->'checks') c)) WHERE id = $1`,
      [allMetDown.id],
    );
    const journey = await p.journey(stepping.infant.id);
    await p.createdAt('journeys', journey.id, '2026-11-30T16:00:00Z');
    const [{ unmet }] = await ctx.deps.ds.query(
      `SELECT count(*)::int AS unmet FROM prescriptions, jsonb_array_elements(evidence->'checks') c WHERE id = $1 AND (c->>'met')::boolean = false`, [stepDown.id]);
    expect(unmet).toBeGreaterThan(0);

    const body = consultantOverviewSchema.parse((await p.consultant.get('/api/overview').expect(200)).body);
    expect(body.proposals).toEqual({ count: 3, oldestSince: '2026-11-26T08:00:00.000Z' });
    expect(body.journeys).toEqual({ count: 1, oldestSince: '2026-11-30T16:00:00.000Z' });
    expect(body.unmetStepDowns).toHaveLength(1);
    expect(body.unmetStepDowns[0]).toMatchObject({ prescriptionId: stepDown.id, unmetRules: unmet });
    expect(body.unmetStepDowns[0].infantName).toMatch(/^Test Baby /);
  });
});

describe('who may open an overview', () => {
  it('when a nurse or a family asks, then 403; when nobody is signed in, then 401', async () => {
    const p = await overviewClinic(ctx.deps, ctx.app);
    const nurse = await signedInAgent(ctx.app, p.clinic.people.nurse.email);
    const family = await signedInAgent(ctx.app, p.clinic.people.family.email);
    expect((await nurse.get('/api/overview').expect(403)).body.error.code).toBe('forbidden');
    await family.get('/api/overview').expect(403);
    await (await anonymousAgent(ctx.app)).get('/api/overview').expect(401);
  });
});
