import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic, runPendingConversions } from '../helpers/infants';
import { replan } from '../../server/modules/schedule/planning';
import { createStepDownsService } from '../../server/modules/step-downs/step-downs.service';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

/** A baby at home on an approved plan, with its people signed in. */
async function babyAtHome() {
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const infant = (await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(enrolmentBody(clinic, { familyEmail: clinic.people.family.email, weightKg: 3, flowLpm: 0.25, homeElevationM: 40 })).expect(201)).body;
  await runPendingConversions(ctx.deps, infant.id);
  const consultant = await signedInAgent(ctx.app, clinic.people.consultant.email);
  const [rx] = (await consultant.get(`/api/infants/${infant.id}/prescriptions`)).body.items;
  await consultant.post(`/api/prescriptions/${rx.id}/decision`).set('X-CSRF-Token', consultant.csrf).send({ decision: 'approve' }).expect(200);
  await replan(ctx.deps.repos, { infantIds: [infant.id] });
  const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
  return { clinic, infant, coord, consultant, nurse, rx };
}

const reading = (over: Record<string, unknown> = {}) => ({ takenAt: new Date(Date.now() - 60_000).toISOString(), spo2: 95, pulse: 140, flowLpm: 0.25, state: 'asleep', ...over });
const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);

describe('schedule', () => {
  it('when a plan is approved and planned, then the first check and routine checks exist once, even after re-planning', async () => {
    const { infant, nurse } = await babyAtHome();
    await replan(ctx.deps.repos, { infantIds: [infant.id] });
    const s = (await nurse.get(`/api/infants/${infant.id}/schedule`).expect(200)).body;
    const keys = s.upcoming.map((c: { planKey: string }) => c.planKey);
    expect(keys).toEqual(expect.arrayContaining(['first-home', 'week-1', 'week-4', 'study-before-step-down-v1', 'step-down-review-v1']));
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM checks WHERE infant_id = $1`, [infant.id]);
    expect(n).toBe(keys.length);
  });

  it('when a check is past due, then the daily job marks it overdue and flags the baby; it shows on the nurse\'s day', async () => {
    const { infant, nurse } = await babyAtHome();
    await ctx.deps.ds.query(`UPDATE checks SET due_at = now() - interval '2 hours', due_date = current_date - 1 WHERE infant_id = $1 AND plan_key = 'first-home'`, [infant.id]);
    await ctx.deps.repos.checks.markOverdue();
    expect((await nurse.get(`/api/infants/${infant.id}`).expect(200)).body.flags).toContain('check_overdue');
    const day = (await nurse.get('/api/my-day').expect(200)).body;
    expect(day.items.map((i: { planKey: string; status: string }) => `${i.planKey}:${i.status}`)).toContain('first-home:overdue');
  });

  it('when another nurse or a family asks for the schedule or the day, then 404 / 403', async () => {
    const { infant, clinic } = await babyAtHome();
    const other = await makeUser(ctx.deps, clinic.programme.id, 'nurse');
    const a = await signedInAgent(ctx.app, other.email);
    await a.get(`/api/infants/${infant.id}/schedule`).expect(404);
    expect((await a.get('/api/my-day').expect(200)).body.items).toEqual([]);
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    await family.get('/api/my-day').expect(403);
    await family.get(`/api/infants/${infant.id}/schedule`).expect(403);
  });
});

describe('readings', () => {
  it('when the nurse logs a reading against a planned check, then it is stored, completes the check and clears the overdue flag', async () => {
    const { infant, nurse } = await babyAtHome();
    await ctx.deps.ds.query(`UPDATE checks SET status = 'overdue' WHERE infant_id = $1 AND plan_key = 'first-home'`, [infant.id]);
    await ctx.deps.ds.query(`UPDATE infants SET flags = array_append(flags, 'check_overdue') WHERE id = $1`, [infant.id]);
    const [check] = await ctx.deps.ds.query(`SELECT id FROM checks WHERE infant_id = $1 AND plan_key = 'first-home'`, [infant.id]);
    const res = await post(nurse, `/api/infants/${infant.id}/readings`, reading({ checkId: check.id })).expect(201);
    expect(res.body).toMatchObject({ spo2: 95, pulse: 140, state: 'asleep', familyReported: false, checkId: check.id });
    const [c] = await ctx.deps.ds.query(`SELECT status, done_ref FROM checks WHERE id = $1`, [check.id]);
    expect(c).toEqual({ status: 'done', done_ref: `reading:${res.body.id}` });
    expect((await nurse.get(`/api/infants/${infant.id}`)).body.flags).not.toContain('check_overdue');
    const list = (await nurse.get(`/api/infants/${infant.id}/readings`).expect(200)).body.items;
    expect(list.map((r: { id: string }) => r.id)).toEqual([res.body.id]);
  });

  it('when readings are listed, then they come oldest first, each as it was answered when saved (who logged it, until when it may be corrected), and a window narrows them', async () => {
    const { infant, nurse, clinic } = await babyAtHome();
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
    const later = (await post(nurse, `/api/infants/${infant.id}/readings`, reading({ takenAt: hoursAgo(1), notes: 'settled' })).expect(201)).body;
    const earlier = (await post(family, `/api/infants/${infant.id}/readings`, reading({ takenAt: hoursAgo(3), spo2: 93, state: 'awake' })).expect(201)).body;
    expect(later.createdBy).toEqual({ id: clinic.people.nurse.id, name: clinic.people.nurse.name });
    expect(later.editableUntil).not.toBeNull();
    expect(earlier.editableUntil).toBeNull();
    expect((await nurse.get(`/api/infants/${infant.id}/readings`).expect(200)).body.items).toEqual([earlier, later]);
    const window = new URLSearchParams({ from: hoursAgo(2), to: new Date(Date.now()).toISOString() });
    expect((await nurse.get(`/api/infants/${infant.id}/readings?${window}`).expect(200)).body.items).toEqual([later]);
    // A baby with no readings yet: an empty list, not a missing baby.
    const none = await babyAtHome();
    expect((await none.nurse.get(`/api/infants/${none.infant.id}/readings`).expect(200)).body.items).toEqual([]);
  });

  it('when values are out of range, then 400 per field and nothing is stored', async () => {
    const { infant, nurse } = await babyAtHome();
    const res = await post(nurse, `/api/infants/${infant.id}/readings`, reading({ spo2: 49, pulse: 251, state: 'running', weightKg: 30 })).expect(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['pulse', 'spo2', 'state', 'weightKg']);
    // a weight far from the last one must be confirmed (422), and is stored once it is (common practice, > 20 %)
    const implausible = await post(nurse, `/api/infants/${infant.id}/readings`, reading({ weightKg: 6.5 })).expect(422);
    expect(implausible.body.error).toMatchObject({ code: 'needs_confirmation' });
    expect(implausible.body.error.details.weightKg[0]).toMatch(/more than .* check the number/);
    await post(nurse, `/api/infants/${infant.id}/readings`, reading({ takenAt: new Date(Date.now() + 3_600_000).toISOString() })).expect(400);
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int n FROM readings WHERE infant_id = $1`, [infant.id]);
    expect(n).toBe(0);
  });

  it('when a reading carries a new weight, then the record takes it and a new setting is worked out', async () => {
    const { infant, nurse } = await babyAtHome();
    await post(nurse, `/api/infants/${infant.id}/readings`, reading({ weightKg: 3.6 })).expect(201);
    const detail = (await nurse.get(`/api/infants/${infant.id}`)).body;
    expect(detail.weightKg).toBe(3.6);
    expect(detail.flags).toContain('new_setting_waiting');
    const [{ reason }] = await ctx.deps.ds.query(`SELECT reason FROM prescriptions WHERE infant_id = $1 AND status = 'preparing'`, [infant.id]);
    expect(reason).toBe('weight');
  });

  it('when a family reports a reading, then it is marked family-reported; they cannot log for another baby', async () => {
    const { infant, clinic } = await babyAtHome();
    const other = await babyAtHome();
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    const res = await post(family, `/api/infants/${infant.id}/readings`, reading({ spo2: 92, state: 'awake' })).expect(201);
    expect(res.body.familyReported).toBe(true);
    await post(family, `/api/infants/${other.infant.id}/readings`, reading()).expect(404);
    await family.get(`/api/infants/${infant.id}/readings`).expect(403);
  });

  it('when the author corrects a reading within the window, then it changes and is audited; others cannot', async () => {
    const { infant, nurse, coord } = await babyAtHome();
    const r = (await post(nurse, `/api/infants/${infant.id}/readings`, reading())).body;
    expect(r.rowVersion).toBe(1);
    const fixed = await nurse.patch(`/api/readings/${r.id}`).set('X-CSRF-Token', nurse.csrf).send({ rowVersion: 1, spo2: 94 }).expect(200);
    expect(fixed.body.spo2).toBe(94);
    expect(fixed.body.rowVersion).toBe(2);
    await coord.patch(`/api/readings/${r.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: 2, spo2: 90 }).expect(403);
    await ctx.deps.ds.query(`UPDATE readings SET created_at = now() - interval '2 hours' WHERE id = $1`, [r.id]);
    await nurse.patch(`/api/readings/${r.id}`).set('X-CSRF-Token', nurse.csrf).send({ rowVersion: 2, spo2: 93 }).expect(409);
    const audit = await ctx.deps.repos.audit.listForEntity('infant', infant.id);
    expect(audit.find((a) => a.action === 'reading.corrected')?.details).toMatchObject({ readingId: r.id, before: { spo2: 95 } });
  });

  it('when two corrections are made on the same version of a reading, then the second gets 409 and changes nothing', async () => {
    const { infant, nurse } = await babyAtHome();
    const r = (await post(nurse, `/api/infants/${infant.id}/readings`, reading())).body;
    const patch = (body: object) => nurse.patch(`/api/readings/${r.id}`).set('X-CSRF-Token', nurse.csrf).send(body);
    await patch({ rowVersion: r.rowVersion, spo2: 94 }).expect(200);
    const second = await patch({ rowVersion: r.rowVersion, pulse: 150 });
    expect(second.status).toBe(409);
    expect(second.body.error).toMatchObject({ code: 'conflict', details: { rowVersion: expect.any(Array) } });
    const [stored] = await ctx.deps.ds.query(`SELECT spo2, pulse, row_version FROM readings WHERE id = $1`, [r.id]);
    expect(stored).toMatchObject({ spo2: 94, pulse: r.pulse, row_version: 2 });
    const corrections = (await ctx.deps.repos.audit.listForEntity('infant', infant.id)).filter((a) => a.action === 'reading.corrected');
    expect(corrections).toHaveLength(1);
    // Without the version at all the contract refuses it.
    expect((await patch({ spo2: 93 })).status).toBe(400);
  });

  it('when a consultant or admin tries to log, then 403; signed out 401', async () => {
    const { infant, clinic, consultant } = await babyAtHome();
    await post(consultant, `/api/infants/${infant.id}/readings`, reading()).expect(403);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    await post(admin, `/api/infants/${infant.id}/readings`, reading()).expect(403);
  });
});

// These walk the ladder's mechanics on a baby approved minutes ago, so the programme's rules (time on setting, a
// recent study, readings) are not met: the nurse asks anyway with a recorded reason, and the consultant gives one.
// The rules themselves are tested in tests/api/step-down-rules.test.ts.
const ANYWAY = { overrideReason: 'Walking the ladder for the test; rules checked elsewhere' };
const APPROVE = { decision: 'approve', reason: 'Approved despite the unmet rules for this test' };

describe('stepping down', () => {
  it('when a nurse asks for a step down, then the next rung is proposed; approval lowers the flow and plans a follow-up study', async () => {
    const { infant, nurse, consultant, rx } = await babyAtHome();
    const res = await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Settled overnight, feeding well', ...ANYWAY }).expect(201);
    expect(res.body).toMatchObject({ status: 'proposed', reason: 'step_down' });
    expect(res.body.proposedFlowLpm).toBeCloseTo(rx.proposedFlowLpm - 0.025, 9);
    await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'again', ...ANYWAY }).expect(409);
    const queue = (await consultant.get('/api/prescriptions/queue')).body.items;
    expect(queue.find((q: { prescriptionId: string }) => q.prescriptionId === res.body.id)).toMatchObject({ reason: 'step_down', feasible: true });
    await post(consultant, `/api/prescriptions/${res.body.id}/decision`, APPROVE).expect(200);
    await replan(ctx.deps.repos, { infantIds: [infant.id] });
    const detail = (await nurse.get(`/api/infants/${infant.id}`)).body;
    expect(detail.status).toBe('stepping_down');
    const s = (await nurse.get(`/api/infants/${infant.id}/schedule`)).body;
    expect(s.upcoming.map((c: { planKey: string }) => c.planKey)).toContain(`follow-up-v${res.body.version}`);
    const day = (await nurse.get('/api/my-day').expect(200)).body;
    expect(day.upcoming.map((i: { planKey: string }) => i.planKey)).toContain(`follow-up-v${res.body.version}`);
    expect(day.items.concat(day.upcoming).some((i: { kind: string }) => i.kind === 'step_down_review')).toBe(false);
  });

  it('when a follow-up study after a step down is below target, then stepping back up is proposed', async () => {
    const { infant, nurse, consultant } = await babyAtHome();
    const down = (await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Ready', ...ANYWAY })).body;
    await post(consultant, `/api/prescriptions/${down.id}/decision`, APPROVE).expect(200);
    const service = createStepDownsService(ctx.deps.ds, ctx.deps.repos);
    // Below the BTS/TSANZ target (mean ≥ 93 %, < 5 % of time under 90 %).
    const up = await service.considerStudy(infant.id, { recordingId: 'r1', recordedAt: new Date(Date.now() + 1000), meanSpo2: 91.2, pctBelow90: 8.1, validMinutes: 540 });
    expect(up).toMatchObject({ reason: 'step_up', status: 'proposed' });
    expect((await nurse.get(`/api/infants/${infant.id}`)).body.flags).toEqual(expect.arrayContaining(['below_target', 'new_setting_waiting']));
  });

  it('when a study meets target long enough after approval, then the next step down is proposed by itself', async () => {
    const { infant } = await babyAtHome();
    await ctx.deps.ds.query(`UPDATE prescriptions SET decided_at = now() - interval '20 days' WHERE infant_id = $1 AND status = 'active'`, [infant.id]);
    const service = createStepDownsService(ctx.deps.ds, ctx.deps.repos);
    const short = await service.considerStudy(infant.id, { recordingId: 'r0', recordedAt: new Date(), meanSpo2: 96, pctBelow90: 0.4, validMinutes: 200 });
    expect(short).toBeNull();
    const proposal = await service.considerStudy(infant.id, { recordingId: 'r2', recordedAt: new Date(), meanSpo2: 96, pctBelow90: 0.4, validMinutes: 560 });
    expect(proposal).toMatchObject({ reason: 'step_down', status: 'proposed' });
    expect(proposal!.evidence).toMatchObject({ targetMet: true, recordingId: 'r2' });
  });

  it('when off oxygen past the observation period with a satisfactory study, then leaving the programme is proposed and approval ends the plan', async () => {
    const { infant, nurse, consultant } = await babyAtHome();
    let next = (await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Ready', ...ANYWAY })).body;
    // Walk the ladder to "off": lower steps, then night-only, then off.
    for (let i = 0; i < 30 && next.proposedFlowLpm !== 0; i++) {
      await post(consultant, `/api/prescriptions/${next.id}/decision`, APPROVE).expect(200);
      next = (await post(nurse, `/api/infants/${infant.id}/step-down-requests`, { reason: 'Ready', ...ANYWAY }).expect(201)).body;
    }
    expect(next).toMatchObject({ proposedFlowLpm: 0, evidence: { kind: 'off' } });
    await post(consultant, `/api/prescriptions/${next.id}/decision`, APPROVE).expect(200);
    expect((await nurse.get(`/api/infants/${infant.id}`)).body.status).toBe('off_oxygen');
    await ctx.deps.ds.query(`UPDATE infants SET off_oxygen_since = now() - interval '30 days' WHERE id = $1`, [infant.id]);
    await ctx.deps.ds.query(`UPDATE prescriptions SET decided_at = now() - interval '30 days' WHERE infant_id = $1 AND status = 'active'`, [infant.id]);
    const service = createStepDownsService(ctx.deps.ds, ctx.deps.repos);
    const leave = await service.considerStudy(infant.id, { recordingId: 'r9', recordedAt: new Date(), meanSpo2: 96.5, pctBelow90: 0.2, validMinutes: 600 });
    expect(leave).toMatchObject({ reason: 'leave_programme', status: 'proposed' });
    await post(consultant, `/api/prescriptions/${leave!.id}/decision`, { decision: 'approve' }).expect(200);
    expect((await nurse.get(`/api/infants/${infant.id}`)).body.status).toBe('left_programme');
  });

  it('when a family or consultant asks for a step down, then 403', async () => {
    const { infant, clinic, consultant } = await babyAtHome();
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    await post(family, `/api/infants/${infant.id}/step-down-requests`, { reason: 'please' }).expect(403);
    await post(consultant, `/api/infants/${infant.id}/step-down-requests`, { reason: 'please' }).expect(403);
  });
});

describe('programme policy', () => {
  it('when the admin saves new settings, then a new version is stored and audited; a stale save gets 409', async () => {
    const clinic = await makeClinic(ctx.deps);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    const current = (await admin.get('/api/policy').expect(200)).body;
    expect(current.version).toBe(0);
    const settings = { ...current.settings, spo2Targets: { ...current.settings.spo2Targets, overnightMeanMin: 94 } };
    const saved = (await admin.put('/api/policy').set('X-CSRF-Token', admin.csrf).send({ baseVersion: 0, settings }).expect(200)).body;
    expect(saved).toMatchObject({ version: 1, settings: { spo2Targets: { overnightMeanMin: 94 } } });
    await admin.put('/api/policy').set('X-CSRF-Token', admin.csrf).send({ baseVersion: 0, settings }).expect(409);
    const audit = await ctx.deps.ds.query(`SELECT details FROM audit_events WHERE programme_id = $1 AND action = 'policy.changed'`, [clinic.programme.id]);
    expect(audit[0].details).toEqual({ version: 1, changed: ['spo2Targets.overnightMeanMin'] });
    const history = (await admin.get('/api/policy/history').expect(200)).body.items;
    expect(history[0]).toMatchObject({ version: 1, createdBy: { id: clinic.people.admin.id } });
  });

  it('when settings are invalid or the caller is not the admin, then 400 / 403', async () => {
    const clinic = await makeClinic(ctx.deps);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    const current = (await admin.get('/api/policy')).body;
    const bad = await admin.put('/api/policy').set('X-CSRF-Token', admin.csrf).send({ baseVersion: 0, settings: { ...current.settings, flowmeterStepsLpm: [0.5, 0.25] } }).expect(400);
    expect(bad.body.error.details['settings.flowmeterStepsLpm']).toBeDefined();
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    await coord.put('/api/policy').set('X-CSRF-Token', coord.csrf).send({ baseVersion: 0, settings: current.settings }).expect(403);
    // A family reads its programme's numbers and cylinder list from the policy, but can never change it.
    const family = await signedInAgent(ctx.app, clinic.people.family.email);
    const read = await family.get('/api/policy').expect(200);
    expect(read.body.settings.contacts.emergencyNumber).toBe(current.settings.contacts.emergencyNumber);
    await family.put('/api/policy').set('X-CSRF-Token', family.csrf).send({ baseVersion: current.version, settings: current.settings }).expect(403);
    const other = await makeClinic(ctx.deps);
    const stranger = await signedInAgent(ctx.app, other.people.family.email);
    expect((await stranger.get('/api/policy').expect(200)).body.programmeId).toBe(other.programme.id);
  });
});
