import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent, type Agent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { stubDelivery } from '../helpers/reminders';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);
const put = (a: Agent, body: unknown) => a.put('/api/me/preferences').set('X-CSRF-Token', a.csrf).send(body as object);

/** A baby whose first contact (SMS agreed, Europe/London) is the signed-in family account. */
async function family() {
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const infant = (await post(coord, '/api/infants', enrolmentBody(clinic, { familyEmail: clinic.people.family.email })).expect(201)).body;
  const fam = await signedInAgent(ctx.app, clinic.people.family.email);
  return { clinic, coord, infant, fam };
}

const body = (email: string, over: Record<string, unknown> = {}) => ({
  rowVersion: 1, mobile: '+44 7700 900001', email, preferredChannel: 'sms', consentSms: true, consentEmail: false, language: 'en', remindersEnabled: true, ...over,
});
const contactRow = async (infantId: string) =>
  (await ctx.deps.ds.query(`SELECT id, mobile, email, preferred_channel, consent_sms, consent_email, language, reminders_enabled, row_version FROM family_contacts WHERE infant_id = $1`, [infantId]))[0];

describe('GET /api/me/preferences', () => {
  it("when the family asks, then they get their own contact record as the coordinator entered it", async () => {
    const { clinic, infant, fam } = await family();
    const res = await fam.get('/api/me/preferences').expect(200);
    expect(res.body.preferences).toEqual({
      contactId: (await contactRow(infant.id)).id, name: 'Parent One', relation: 'Mother', mobile: '+447700900001', email: clinic.people.family.email,
      preferredChannel: 'sms', consentSms: true, consentEmail: false, language: 'en', remindersEnabled: true, timeZone: 'Europe/London', country: 'GB', rowVersion: 1,
    });
  });

  it('when nobody is signed in, then 401; when staff ask, then 403', async () => {
    const { clinic } = await family();
    const anon = await anonymousAgent(ctx.app);
    await anon.get('/api/me/preferences').expect(401);
    await put(anon, body('x@test.example')).expect(401);
    for (const role of ['admin', 'coordinator', 'nurse', 'consultant'] as const) {
      const a = await signedInAgent(ctx.app, clinic.people[role].email);
      expect((await a.get('/api/me/preferences').expect(403)).body.error.code).toBe('forbidden');
      await put(a, body('x@test.example')).expect(403);
    }
  });

  it('when a family account has no contact record, then 404', async () => {
    const { clinic } = await family();
    const lone = await makeUser(ctx.deps, clinic.programme.id, 'family');
    const a = await signedInAgent(ctx.app, lone.email);
    expect((await a.get('/api/me/preferences').expect(404)).body.error.code).toBe('not_found');
  });
});

describe('PUT /api/me/preferences', () => {
  it('when the input is bad, then 400 names each field and nothing is stored', async () => {
    const { clinic, infant, fam } = await family();
    const noMobile = await put(fam, body(clinic.people.family.email, { mobile: null, consentSms: false })).expect(400);
    expect(noMobile.body.error.details).toEqual({ mobile: ['Text messages need a mobile number'] });
    const badEmail = await put(fam, body('not-an-address', { preferredChannel: 'email' })).expect(400);
    expect(badEmail.body.error.details).toEqual({ email: ['Enter a valid e-mail address'] });
    const unknown = await put(fam, { ...body(clinic.people.family.email), timeZone: 'Pacific/Auckland', userId: clinic.people.admin.id }).expect(400);
    expect(unknown.body.error.details).toEqual({ _: ['Unknown field(s): timeZone, userId'] });
    const types = await put(fam, body(clinic.people.family.email, { preferredChannel: 'fax', language: 'English', remindersEnabled: 'no' })).expect(400);
    expect(Object.keys(types.body.error.details).sort()).toEqual(['language', 'preferredChannel', 'remindersEnabled']);
    expect(types.body.error.details.preferredChannel).toEqual(['Choose SMS or e-mail']);
    expect(await contactRow(infant.id)).toMatchObject({ mobile: '+447700900001', preferred_channel: 'sms', consent_sms: true, reminders_enabled: true, row_version: 1 });
  });

  it('when the number is a landline, incomplete or not a number, then 400 says why and nothing is stored', async () => {
    const { clinic, infant, fam } = await family();
    const email = clinic.people.family.email;
    // 020 7946 0xxx is a London landline range (Ofcom's drama numbers), 0800 a freephone: neither takes texts.
    for (const mobile of ['020 7946 0123', '0800 123 4567']) {
      const res = await put(fam, body(email, { mobile })).expect(400);
      expect(res.body.error.details).toEqual({ mobile: ['This number cannot receive text messages (a landline or a service number): enter a mobile number'] });
    }
    const short = await put(fam, body(email, { mobile: '07700 90' })).expect(400);
    expect(short.body.error.details.mobile[0]).toMatch(/^This is not a complete phone number/);
    const letters = await put(fam, body(email, { mobile: 'call my mum' })).expect(400);
    expect(letters.body.error.details).toEqual({ mobile: ['Use digits, spaces and an optional leading +'] });
    expect(await contactRow(infant.id)).toMatchObject({ mobile: '+447700900001', row_version: 1 });
  });

  it("when the family types a national number, then it is read in the programme's country and stored in E.164; a foreign one keeps its own code", async () => {
    const { clinic, infant, fam } = await family();
    await put(fam, body(clinic.people.family.email, { mobile: '07700 900111' })).expect(200);
    expect((await contactRow(infant.id)).mobile).toBe('+447700900111');
    // A Spanish mobile (+34 6xx) typed with its country code.
    const res = await put(fam, body(clinic.people.family.email, { rowVersion: 2, mobile: '+34 612 345 678' })).expect(200);
    expect(res.body.preferences).toMatchObject({ mobile: '+34612345678', country: 'GB' });
  });

  it('when an old number could not be read and the family enters a readable one, then the baby loses its "number unreadable" flag', async () => {
    const { clinic, infant, fam } = await family();
    await ctx.deps.ds.query(`UPDATE family_contacts SET mobile = '7700-900' WHERE infant_id = $1`, [infant.id]);
    await ctx.deps.ds.query(`UPDATE infants SET flags = array_append(flags, 'number_unreadable') WHERE id = $1`, [infant.id]);
    await put(fam, body(clinic.people.family.email, { mobile: '07700 900222' })).expect(200);
    const [row] = await ctx.deps.ds.query(`SELECT flags FROM infants WHERE id = $1`, [infant.id]);
    expect(row.flags).not.toContain('number_unreadable');
  });

  it('when the family changes their details, then they are stored, the version moves on, and the change is audited without the addresses', async () => {
    const { clinic, infant, fam } = await family();
    const res = await put(fam, body(clinic.people.family.email, { mobile: '+44 7700 900999', preferredChannel: 'email', consentEmail: true, language: 'es', remindersEnabled: false })).expect(200);
    expect(res.body.preferences).toMatchObject({ mobile: '+447700900999', preferredChannel: 'email', consentEmail: true, language: 'es', remindersEnabled: false, rowVersion: 2 });
    expect(await contactRow(infant.id)).toMatchObject({ mobile: '+447700900999', preferred_channel: 'email', consent_email: true, language: 'es', reminders_enabled: false, row_version: 2 });
    const audit = await ctx.deps.ds.query(`SELECT actor_id, entity_type, details FROM audit_events WHERE action = 'contact.preferences_changed' AND entity_id = $1`, [infant.id]);
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ actor_id: clinic.people.family.id, entity_type: 'infant' });
    expect(audit[0].details).toMatchObject({ remindersEnabled: false, consentSms: true, consentEmail: true, preferredChannel: 'email', language: 'es' });
    expect([...audit[0].details.changed].sort()).toEqual(['consentEmail', 'language', 'mobile', 'preferredChannel', 'remindersEnabled']);
    expect(JSON.stringify(audit[0].details)).not.toContain('900999');
  });

  it('when the family saves from a stale copy, then 409 and the newer details stay', async () => {
    const { clinic, infant, fam } = await family();
    await put(fam, body(clinic.people.family.email, { language: 'es' })).expect(200);
    const res = await put(fam, body(clinic.people.family.email, { rowVersion: 1, remindersEnabled: false })).expect(409);
    expect(res.body.error.code).toBe('conflict');
    expect(await contactRow(infant.id)).toMatchObject({ language: 'es', reminders_enabled: true, row_version: 2 });
  });

  it('when one family account is linked to twins, then one change applies to both babies and each is audited', async () => {
    const { clinic, coord, infant, fam } = await family();
    const twin = (await post(coord, '/api/infants', enrolmentBody(clinic, { familyEmail: clinic.people.family.email })).expect(201)).body;
    await put(fam, body(clinic.people.family.email, { remindersEnabled: false })).expect(200);
    for (const id of [infant.id, twin.id]) {
      expect(await contactRow(id)).toMatchObject({ reminders_enabled: false, row_version: 2 });
      const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM audit_events WHERE action = 'contact.preferences_changed' AND entity_id = $1`, [id]);
      expect(n).toBe(1);
    }
  });
});

describe('turning reminders off, as the delivery service sees it', () => {
  it('when the family turns reminders off, then the next visit reminder is skipped as opted-out, but a moved visit is still told', async () => {
    const { clinic, coord, infant, fam } = await family();
    const visit = (await post(coord, `/api/infants/${infant.id}/visits`, {
      kind: 'home_visit', date: future(3), time: '10:00', durationMinutes: 45, staffId: clinic.people.nurse.id, purpose: 'Spot check and weight',
    }).expect(201)).body;
    // The booking note is a notice, not a reminder (tests/api/visit-booking-note.test.ts); left out here.
    const rows = async () => ctx.deps.ds.query(`SELECT id, template, status, reason, send_at FROM reminders WHERE visit_id = $1 AND template NOT IN ('visit-booked', 'visit-today') ORDER BY send_at, template`, [visit.id]);
    const [dayBefore, morning] = await rows();
    expect([dayBefore.template, morning.template]).toEqual(['visit-day-before', 'visit-morning']);
    const { delivery, texts, mails } = stubDelivery(ctx.deps);

    // While reminders are on, the day-before reminder goes by SMS at its time.
    expect(await delivery.deliver(dayBefore.id, { finalAttempt: false, now: new Date(dayBefore.send_at) })).toBe('sent');
    expect(texts.map((t) => t.to)).toEqual(['+447700900001']);

    await put(fam, body(clinic.people.family.email, { remindersEnabled: false })).expect(200);
    expect(await delivery.deliver(morning.id, { finalAttempt: false, now: new Date(morning.send_at) })).toBe('skipped');
    expect(texts).toHaveLength(1);
    expect(mails).toHaveLength(0);
    const [stored] = await ctx.deps.ds.query(`SELECT status, reason, attempts FROM reminders WHERE id = $1`, [morning.id]);
    expect(stored).toEqual({ status: 'skipped', reason: 'opted-out', attempts: 0 });
    const logged = (await coord.get(`/api/messages?infantId=${infant.id}&status=skipped`).expect(200)).body.items;
    expect(logged.map((m: { id: string; reason: string }) => [m.id, m.reason])).toEqual([[morning.id, 'The family turned reminders off']]);

    // Moving the visit: the family is told (a change note is not a reminder); the new reminders are planned as skipped.
    await coord.patch(`/api/visits/${visit.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: visit.rowVersion, time: '14:00' }).expect(200);
    const after = await rows();
    const note = after.find((r: { template: string }) => r.template === 'visit-moved');
    expect(note.status).toBe('scheduled');
    expect(after.filter((r: { template: string; status: string }) => r.template !== 'visit-moved' && r.status !== 'sent').map((r: { template: string; status: string; reason: string }) => [r.template, r.status, r.reason]).sort())
      .toEqual([['visit-day-before', 'skipped', 'opted-out'], ['visit-morning', 'skipped', 'opted-out'], ['visit-morning', 'skipped', 'opted-out']]);
    expect(await delivery.deliver(note.id, { finalAttempt: false, now: new Date(note.send_at) })).toBe('sent');
    expect(texts).toHaveLength(2);
    expect(texts[1]).toMatchObject({ to: '+447700900001' });
    expect(texts[1].body).toContain('has moved. New time:');
    expect(texts[1].body).toContain('at 14:00');
  });
});
