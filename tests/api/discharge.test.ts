import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_DISCHARGE_RULES, FAMILY_GROUPS } from '@shared/schemas/discharge-policy';
import { dischargeItemSchema, dischargeSchema } from '@shared/schemas/discharge';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { makeClinic, enrolmentBody } from '../helpers/infants';
import { makeUser } from '../helpers/factories';
import { approvedBaby, post } from '../helpers/approved-baby';
import { evidenceFor, put, tickAll } from '../helpers/discharge';

// Every check runs at this instant, so "today" and the first visit's date never depend on the wall clock.
const NOW = '2026-12-03T10:00:00Z';
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
});
afterAll(() => ctx.close());

const KEYS = DEFAULT_DISCHARGE_RULES.items.map((i) => i.key);
const auditRows = (infantId: string, action: string) =>
  ctx.deps.ds.query(`SELECT actor_id, details FROM audit_events WHERE entity_id = $1 AND action = $2 ORDER BY id`, [infantId, action]);

describe('GET /api/infants/:id/discharge', () => {
  it('when nothing is ticked, then every policy item is listed by group, not done, and the baby is not ready', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    const body = (await coord.get(`/api/infants/${infant.id}/discharge`).expect(200)).body;
    expect(dischargeSchema.safeParse(body).error).toBeUndefined();
    expect(body.items.map((i: { key: string }) => i.key).sort()).toEqual([...KEYS].sort());
    expect(body.items[0]).toMatchObject({ key: 'equipment_use', group: 'family_training', done: false, doneBy: null, doneAt: null, note: '' });
    expect(body).toMatchObject({ ready: false, settingApproved: true, dischargedOn: null, firstVisit: null });
    expect(body.missing).toEqual(KEYS);
  });

  it('when the caller is in another programme, then the baby is 404; a nurse off the caseload gets 404 too', async () => {
    const { infant, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const other = await makeClinic(ctx.deps);
    const stranger = await signedInAgent(ctx.app, other.people.coordinator.email);
    await stranger.get(`/api/infants/${infant.id}/discharge`).expect(404);
    await put(stranger, `/api/infants/${infant.id}/discharge/items/no_smoking`, { done: true }).expect(404);
    await post(stranger, `/api/infants/${infant.id}/discharge`, { date: '2026-12-10', overrideReason: 'Family moving away' }).expect(404);
    await stranger.get(`/api/infants/${infant.id}/discharge-letter.pdf`).expect(404);
    const otherConsultant = await signedInAgent(ctx.app, other.people.consultant.email);
    await post(otherConsultant, `/api/infants/${infant.id}/discharge`, { date: '2026-12-10', overrideReason: 'Family moving away' }).expect(404);
    const nurse = await makeUser(ctx.deps, clinic.programme.id, 'nurse');
    const offCaseload = await signedInAgent(ctx.app, nurse.email);
    await offCaseload.get(`/api/infants/${infant.id}/discharge`).expect(404);
  });

  it('when the family looks, then they see only training and home-safety items, in plain words, with nothing about equipment or letters', async () => {
    const { infant, coord, family } = await approvedBaby(ctx.deps, ctx.app);
    await put(coord, `/api/infants/${infant.id}/discharge/items/no_smoking`, { done: true, note: 'Grandfather smokes outside only' }).expect(200);
    await put(coord, `/api/infants/${infant.id}/discharge/items/equipment_ordered`, { done: true }).expect(200);
    const body = (await family.get(`/api/infants/${infant.id}/discharge`).expect(200)).body;
    expect(dischargeSchema.safeParse(body).error).toBeUndefined();
    const expected = DEFAULT_DISCHARGE_RULES.items.filter((i) => i.familySees);
    expect(body.items.map((i: { key: string }) => i.key)).toEqual(expected.map((i) => i.key));
    for (const item of body.items) expect(FAMILY_GROUPS).toContain(item.group);
    const smoking = body.items.find((i: { key: string }) => i.key === 'no_smoking');
    expect(smoking).toMatchObject({ label: 'Nobody smokes or vapes in your home', done: true, note: '', doneBy: null });
    const text = JSON.stringify(body);
    expect(text).not.toMatch(/equipment_ordered|order|letter|Grandfather/i);
    expect(body.override).toBeNull();
    // Families read; they do not tick.
    await put(family, `/api/infants/${infant.id}/discharge/items/no_smoking`, { done: false }).expect(403);
    await family.get(`/api/infants/${infant.id}/discharge-letter.pdf`).expect(403);
  });
});

describe('PUT /api/infants/:id/discharge/items/:key', () => {
  it('when the coordinator ticks an item with its evidence, then it is stored with who and when (the clock) and audited', async () => {
    const { infant, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const res = await put(coord, `/api/infants/${infant.id}/discharge/items/home_assessment`, {
      done: true, note: 'Cylinders in the hall cupboard', evidence: { date: '2026-12-01', person: 'Nurse Tamsin Reed' },
    }).expect(200);
    expect(res.body).toMatchObject({
      key: 'home_assessment', group: 'home_safety', done: true, doneAt: NOW.replace('Z', '.000Z'), note: 'Cylinders in the hall cupboard',
      doneBy: { id: clinic.people.coordinator.id, name: clinic.people.coordinator.name }, evidence: { date: '2026-12-01', person: 'Nurse Tamsin Reed' },
    });
    const [row] = await auditRows(infant.id, 'discharge.item_changed');
    expect(row.actor_id).toBe(clinic.people.coordinator.id);
    expect(row.details).toMatchObject({ key: 'home_assessment', done: true });
    // Unticking clears who and when but keeps the note.
    const undone = (await put(coord, `/api/infants/${infant.id}/discharge/items/home_assessment`, { done: false }).expect(200)).body;
    expect(dischargeItemSchema.safeParse(undone).error).toBeUndefined();
    expect(undone).toMatchObject({ done: false, doneBy: null, doneAt: null, evidence: null, note: 'Cylinders in the hall cupboard' });
  });

  it('when evidence the item needs is missing, then 400 names each field and nothing is saved', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    const res = await put(coord, `/api/infants/${infant.id}/discharge/items/home_assessment`, { done: true, evidence: { date: '2026-12-01' } }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details).toEqual({ 'evidence.person': ['Say who did it'] });
    expect(res.body.error.requestId).toBeTruthy();
    const bad = await put(coord, `/api/infants/${infant.id}/discharge/items/home_assessment`, { done: 'yes', evidence: { date: '1 Dec' } }).expect(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['done', 'evidence.date']);
    const body = (await coord.get(`/api/infants/${infant.id}/discharge`).expect(200)).body;
    expect(body.items.find((i: { key: string }) => i.key === 'home_assessment').done).toBe(false);
    expect(await auditRows(infant.id, 'discharge.item_changed')).toHaveLength(0);
  });

  it('when the key is not on the programme checklist, then 404', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    const res = await put(coord, `/api/infants/${infant.id}/discharge/items/not_an_item`, { done: true }).expect(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('the baby\'s nurse and the settings', () => {
  it('when the baby\'s nurse ticks the training they gave, then it is saved; the nurse cannot override a missing step', async () => {
    const { infant, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    const item = (await put(nurse, `/api/infants/${infant.id}/discharge/items/basic_life_support`, {
      done: true, evidence: { date: '2026-12-02', person: clinic.people.nurse.name },
    }).expect(200)).body;
    expect(item.doneBy).toEqual({ id: clinic.people.nurse.id, name: clinic.people.nurse.name });
    await tickAll(coord, infant.id, ['smoke_alarms']);
    await post(nurse, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08', overrideReason: 'Alarms checked by phone' }).expect(403);
    // An admin reads the checklist but changes nothing.
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    await admin.get(`/api/infants/${infant.id}/discharge`).expect(200);
    await put(admin, `/api/infants/${infant.id}/discharge/items/smoke_alarms`, { done: true }).expect(403);
  });

  it('when the admin saves a checklist that breaks the rules, then 400 names the item and field and the version is not saved', async () => {
    const { clinic } = await approvedBaby(ctx.deps, ctx.app);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    const policy = (await admin.get('/api/policy').expect(200)).body;
    const items = policy.settings.discharge.items.map((i: { key: string }, n: number) => (n === 12 ? { ...i, familySees: true, familyLabel: 'Your nurse' } : i));
    const res = await admin.put('/api/policy').set('X-CSRF-Token', admin.csrf)
      .send({ baseVersion: policy.version, settings: { ...policy.settings, discharge: { items, firstVisitDaysAfterDischarge: 40 } } }).expect(400);
    expect(res.body.error.details).toMatchObject({
      'settings.discharge.items.12.familySees': ['Families see only family training and home safety items'],
      'settings.discharge.firstVisitDaysAfterDischarge': ['At most 28'],
    });
    expect((await admin.get('/api/policy').expect(200)).body.version).toBe(policy.version);
  });
});

describe('POST /api/infants/:id/discharge', () => {
  it('when the checklist is incomplete, then 422 discharge_not_ready lists the missing keys and nothing is set', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id, ['smoke_alarms', 'equipment_installed']);
    const res = await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08' }).expect(422);
    expect(res.body.error).toMatchObject({ code: 'discharge_not_ready', details: { missing: ['smoke_alarms', 'equipment_installed'] } });
    expect((await coord.get(`/api/infants/${infant.id}/discharge`)).body.dischargedOn).toBeNull();
  });

  it('when the setting is not approved, then setting_approved is first among the missing', async () => {
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const infant = (await post(coord, '/api/infants', enrolmentBody(clinic)).expect(201)).body;
    await tickAll(coord, infant.id);
    const res = await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08' }).expect(422);
    expect(res.body.error.details.missing).toEqual(['setting_approved']);
    // No approved setting: the letter refuses rather than print a proposal as the setting.
    expect((await coord.get(`/api/infants/${infant.id}/discharge-letter.pdf`).expect(409)).body.error.code).toBe('conflict');
  });

  it('when everything is done, then the date is set, audited, and the first home visit is proposed at the policy interval', async () => {
    const { infant, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id);
    expect((await coord.get(`/api/infants/${infant.id}/discharge`)).body).toMatchObject({ ready: true, missing: [] });
    const res = await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08' }).expect(200);
    // Default interval: 1 day after discharge (common practice, shared/schemas/discharge-policy.ts).
    expect(res.body).toMatchObject({ dischargedOn: '2026-12-08', override: null, firstVisit: { proposedOn: '2026-12-09', bookedVisitId: null } });
    const [row] = await auditRows(infant.id, 'discharge.date_set');
    expect(row).toMatchObject({ actor_id: clinic.people.coordinator.id, details: { date: '2026-12-08', firstVisitOn: '2026-12-09', before: null } });
  });

  it('when the programme sets a 3-day interval, then the first visit is proposed 3 days after', async () => {
    const { infant, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    const policy = (await admin.get('/api/policy').expect(200)).body;
    await admin.put('/api/policy').set('X-CSRF-Token', admin.csrf)
      .send({ baseVersion: policy.version, settings: { ...policy.settings, discharge: { ...policy.settings.discharge, firstVisitDaysAfterDischarge: 3 } } }).expect(200);
    await tickAll(coord, infant.id);
    // Month end: 30 Dec + 3 days is 2 Jan.
    const res = await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-30' }).expect(200);
    expect(res.body.firstVisit.proposedOn).toBe('2027-01-02');
  });

  it('when the visit is then booked, then the proposal shows the booked visit', async () => {
    const { infant, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id);
    await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08' }).expect(200);
    const visit = (await post(coord, `/api/infants/${infant.id}/visits`, {
      kind: 'home_visit', date: '2026-12-09', time: '10:00', durationMinutes: 60, staffId: clinic.people.nurse.id, purpose: 'First home visit after discharge',
    }).expect(201)).body;
    expect((await coord.get(`/api/infants/${infant.id}/discharge`)).body.firstVisit).toEqual({ proposedOn: '2026-12-09', bookedVisitId: visit.id, visitOn: '2026-12-09' });
  });

  it('when the first visit is booked on another day than proposed, then that day is shown; a cancelled visit answers nothing', async () => {
    const { infant, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id);
    await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08' }).expect(200);
    const book = async (date: string) => (await post(coord, `/api/infants/${infant.id}/visits`, {
      kind: 'home_visit', date, time: '10:00', durationMinutes: 60, staffId: clinic.people.nurse.id, purpose: 'First home visit after discharge',
    }).expect(201)).body;
    const early = await book('2026-12-10');
    const later = await book('2026-12-11');
    expect((await coord.get(`/api/infants/${infant.id}/discharge`)).body.firstVisit).toEqual({ proposedOn: '2026-12-09', bookedVisitId: early.id, visitOn: '2026-12-10' });
    await post(coord, `/api/visits/${early.id}/cancel`, { reason: 'Family away that day' }).expect(200);
    expect((await coord.get(`/api/infants/${infant.id}/discharge`)).body.firstVisit).toEqual({ proposedOn: '2026-12-09', bookedVisitId: later.id, visitOn: '2026-12-11' });
  });

  it('when a coordinator tries to override, then 403; a consultant with a reason may, and the reason and what was missing are kept', async () => {
    const { infant, coord, consultant, clinic } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id, ['smoke_alarms']);
    const refused = await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08', overrideReason: 'Alarms fitted on the day' }).expect(403);
    expect(refused.body.error.code).toBe('forbidden');
    // A consultant without a reason is told what is missing, like anyone else.
    await post(consultant, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08' }).expect(422);
    const short = await post(consultant, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08', overrideReason: 'ok' }).expect(400);
    expect(short.body.error.details.overrideReason).toBeDefined();
    const res = await post(consultant, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08', overrideReason: 'Alarms fitted on the day by the fire service' }).expect(200);
    expect(res.body.override).toEqual({ reason: 'Alarms fitted on the day by the fire service', by: { id: clinic.people.consultant.id, name: clinic.people.consultant.name }, missing: ['smoke_alarms'] });
    const [row] = await auditRows(infant.id, 'discharge.date_overridden');
    expect(row).toMatchObject({ actor_id: clinic.people.consultant.id, details: { missing: ['smoke_alarms'], reason: 'Alarms fitted on the day by the fire service' } });
    expect(await auditRows(infant.id, 'discharge.date_set')).toHaveLength(0);
  });

  it('when the date is far from today, then 400 on the date', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id);
    // Today is 3 Dec 2026 (the injected clock): 28 days back is 5 Nov, the first accepted day.
    await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-11-04' }).expect(400);
    await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2028-01-01' }).expect(400);
    await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-11-05' }).expect(200);
  });
});

describe('a baby who has left the programme', () => {
  it('when someone ticks an item or sets the date after the baby left, then 409 and nothing changes; reading still works', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    await put(coord, `/api/infants/${infant.id}/discharge/items/${KEYS[0]}`, { done: true, evidence: evidenceFor(KEYS[0]!) }).expect(200);
    await ctx.deps.ds.query(`UPDATE infants SET status = 'left_programme' WHERE id = $1`, [infant.id]);
    const untick = await put(coord, `/api/infants/${infant.id}/discharge/items/${KEYS[0]}`, { done: false }).expect(409);
    expect(untick.body.error).toMatchObject({ code: 'conflict', message: 'This baby has left the programme: the discharge checklist is closed.' });
    await put(coord, `/api/infants/${infant.id}/discharge/items/${KEYS[1]}`, { done: true, evidence: evidenceFor(KEYS[1]!) }).expect(409);
    await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-01' }).expect(409);
    const after = dischargeSchema.parse((await coord.get(`/api/infants/${infant.id}/discharge`).expect(200)).body);
    expect(after.items.filter((i) => i.done).map((i) => i.key)).toEqual([KEYS[0]]);
    expect(after.dischargedOn).toBeNull();
  });
});

describe('POST /api/infants/:id/discharge-letter/email', () => {
  it('when the coordinator e-mails the letter, then the fake receives it with the PDF attached, and it is audited', async () => {
    const { infant, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const res = await post(coord, `/api/infants/${infant.id}/discharge-letter/email`, { to: 'surgery@larkmoor.example' }).expect(200);
    expect(res.body.sentTo).toBe('surgery@larkmoor.example');
    const message = ctx.mail.messages().find((m) => m.raw.includes('surgery@larkmoor.example'))!;
    expect(message.subject).toBe(`Home oxygen discharge letter: ${infant.givenName} ${infant.familyName}`);
    expect(message.raw).toMatch(/Content-Type: application\/pdf/i);
    const [row] = await auditRows(infant.id, 'discharge.letter_emailed');
    expect(row).toMatchObject({ actor_id: clinic.people.coordinator.id, details: { to: 'surgery@larkmoor.example' } });
    const bad = await post(coord, `/api/infants/${infant.id}/discharge-letter/email`, { to: 'not an address' }).expect(400);
    expect(bad.body.error.details.to).toBeDefined();
  });
});

it('every default item names a source: a publication or common practice', () => {
  for (const item of DEFAULT_DISCHARGE_RULES.items) expect(item.source).toMatch(/Thorax 2009|Am J Respir Crit Care Med 2019|^common practice$/);
  expect(evidenceFor('home_assessment')).toEqual({ date: '2026-11-28', person: 'Nurse Tamsin Reed' });
});

describe('GET /api/overview (coordinator): babies going home', () => {
  it('when one baby has a date and another is part done, then both are listed with what is missing; untouched babies are not', async () => {
    const { infant: ready, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, ready.id);
    await post(coord, `/api/infants/${ready.id}/discharge`, { date: '2026-12-08' }).expect(200);
    const part = (await post(coord, '/api/infants', enrolmentBody(clinic)).expect(201)).body;
    await put(coord, `/api/infants/${part.id}/discharge/items/no_smoking`, { done: true }).expect(200);
    await post(coord, '/api/infants', enrolmentBody(clinic)).expect(201);
    const body = (await coord.get('/api/overview').expect(200)).body;
    expect(body.discharges.withDate).toBe(1);
    expect(body.discharges.preparing).toBe(1);
    const [first, second] = body.discharges.babies;
    expect(first).toEqual({ infantId: ready.id, infantName: `${ready.givenName} ${ready.familyName}`, dischargedOn: '2026-12-08', missing: [] });
    expect(second.infantId).toBe(part.id);
    expect(second.dischargedOn).toBeNull();
    // Not approved yet, and every item but the one ticked.
    expect(second.missing[0]).toEqual({ key: 'setting_approved', label: 'Setting approved by a consultant' });
    expect(second.missing).toHaveLength(KEYS.length);
    expect(second.missing.map((m: { key: string }) => m.key)).not.toContain('no_smoking');
    // Another programme's coordinator sees none of them.
    const other = await makeClinic(ctx.deps);
    const stranger = await signedInAgent(ctx.app, other.people.coordinator.email);
    expect((await stranger.get('/api/overview').expect(200)).body.discharges).toEqual({ withDate: 0, preparing: 0, babies: [] });
  });

  it('when the discharge date has passed, then the baby leaves the list', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id);
    // Yesterday by the injected clock (3 Dec 2026).
    await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-02' }).expect(200);
    expect((await coord.get('/api/overview').expect(200)).body.discharges.babies).toEqual([]);
  });
});
