import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localParts, planVisitReminders } from '@shared/reminders/timing';
import { reconcileReminders } from '../../server/modules/reminders/reconcile';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { bringForward, policyWithoutQuietHours, startMessaging, testMobile, waitFor, type Messaging } from '../helpers/messaging';

let ctx: TestContext;
let msg: Messaging;
beforeAll(async () => {
  ctx = await createTestContext();
  msg = await startMessaging(ctx.deps);
});
afterAll(async () => {
  await msg?.close();
  await ctx?.close();
});

const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);
const visitBody = (staffId: string, over: Record<string, unknown> = {}) => ({ kind: 'home_visit', date: future(5), time: '10:30', durationMinutes: 45, staffId, purpose: 'Spot check and weight', ...over });

interface Row { id: string; template: string; status: string; reason: string | null; send_at: Date; channel: string | null; to_address: string | null; attempts: number; provider_id: string | null; contact_id: string | null; user_id: string | null; last_error: string | null }
// The booking note (tests/api/visit-booking-note.test.ts) goes at once; these tests are about the reminders after it.
const NOTES = `('visit-booked', 'visit-today')`;
const rowsOf = (visitId: string): Promise<Row[]> => ctx.deps.ds.query(`SELECT * FROM reminders WHERE visit_id = $1 AND template NOT IN ${NOTES} ORDER BY send_at, template`, [visitId]);

/** Books a visit and waits until its booking note has settled, so a fault set up next meets the reminder under test. */
async function book(coord: Agent, infantId: string, body: Record<string, unknown>) {
  const visit = (await post(coord, `/api/infants/${infantId}/visits`, body).expect(201)).body;
  await waitFor('the booking note', async () => {
    const rows: Array<{ status: string }> = await ctx.deps.ds.query(`SELECT status FROM reminders WHERE visit_id = $1 AND template IN ${NOTES}`, [visit.id]);
    return rows.length > 0 && rows.every((r) => r.status !== 'scheduled');
  });
  return visit;
}
/** What reached a number or an address, the booking notes left out. */
async function notesSent(): Promise<Set<string>> {
  const rows: Array<{ id: string; provider_id: string | null }> = await ctx.deps.ds.query(`SELECT id, provider_id FROM reminders WHERE template IN ${NOTES}`);
  return new Set(rows.flatMap((r) => [r.provider_id ?? '', `<reminder-${r.id}@nestflow.invalid>`]));
}
const smsTo = async (mobile: string) => {
  const notes = await notesSent();
  return msg.sms.messages().filter((m) => m.to === mobile && !notes.has(m.sid));
};
const mailTo = async (address: string) => {
  const notes = await notesSent();
  return msg.mail.messages().filter((m) => m.envelope.to.includes(address) && !notes.has(String(m.headers['message-id'])));
};

/** "Time passes": the reminders' moment is brought to now, as a fake clock would, and the reconciler runs. */
async function makeDue(ids: string[]) {
  await ctx.deps.ds.query(`UPDATE reminders SET send_at = now() WHERE id = ANY($1)`, [ids]);
  await reconcileReminders(ctx.deps.repos, msg.queue, msg.jobOptions);
}
const settled = (ids: string[]) => waitFor('reminders to settle', async () => {
  const rows: Row[] = await ctx.deps.ds.query(`SELECT * FROM reminders WHERE id = ANY($1)`, [ids]);
  return rows.every((r) => r.status !== 'scheduled') && rows;
});

async function family(opts: { timeZone?: string; channel?: 'sms' | 'email' } = {}) {
  const clinic = await makeClinic(ctx.deps);
  await policyWithoutQuietHours(ctx.deps, clinic.programme.id);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const body = enrolmentBody(clinic);
  body.contacts[0] = { ...body.contacts[0], timeZone: opts.timeZone ?? 'America/Denver', mobile: testMobile(),
    email: `parent-${Math.random().toString(36).slice(2, 8)}@test.example`, consentEmail: true, preferredChannel: opts.channel ?? 'sms' };
  const infant = (await post(coord, '/api/infants', body).expect(201)).body;
  return { clinic, coord, infant, contact: body.contacts[0] };
}

// Quiet hours and the morning digests are tested at fixed instants (midnight, noon, both clock changes) in
// clock-instants.test.ts, so this file holds nothing that depends on the hour it runs.
describe('reminders on real PostgreSQL, Redis and both fakes', () => {
  it('when a visit is booked, then one reminder row per reminder is written at the right moments and each goes out exactly once', async () => {
    const { clinic, coord, infant, contact } = await family({ timeZone: 'America/Denver' });
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    const rows = await rowsOf(visit.id);
    expect(rows.map((r) => r.template)).toEqual(['visit-day-before', 'visit-morning']);
    // The moments follow the family's own clock (Denver) and the policy times: 17:00 the day before, 08:00 on the day.
    const expected = planVisitReminders({ date: visit.date, time: visit.time, timeZone: 'America/Denver', startsAt: new Date(visit.startsAt) },
      { dayBeforeAt: '17:00', morningOfAt: '08:00', quietStart: '00:00', quietEnd: '00:00' }, new Date());
    expect(rows.map((r) => new Date(r.send_at).toISOString())).toEqual(expected.map((e) => e.sendAt.toISOString()));
    expect(rows.every((r) => r.status === 'scheduled' && r.channel === 'sms' && r.to_address === contact.mobile!.replace(/ /g, ''))).toBe(true);

    await makeDue(rows.map((r) => r.id));
    const done = await settled(rows.map((r) => r.id));
    expect(done.map((r) => r.status)).toEqual(['sent', 'sent']);
    const inbox = await smsTo(contact.mobile!);
    expect(inbox).toHaveLength(2);
    expect(inbox.map((m) => m.body).join('\n')).toContain('home visit tomorrow');
    expect(inbox.map((m) => m.body).join('\n')).toContain('home visit is today at 10:30');
    expect(new Set(done.map((r) => r.provider_id))).toEqual(new Set(inbox.map((m) => m.sid)));
    // The SDK's own client made the call, not a hand-made request.
    expect(inbox[0].userAgent).toMatch(/twilio-node/);

    // A second reconcile and a direct second delivery are no-ops: the ledger says sent.
    await reconcileReminders(ctx.deps.repos, msg.queue, msg.jobOptions);
    expect(await msg.delivery.deliver(rows[0].id, { finalAttempt: false })).toBe('already-done');
    await new Promise((r) => setTimeout(r, 300));
    expect((await smsTo(contact.mobile!))).toHaveLength(2);
  });

  it("when a second contact lives in another time zone, then their reminders follow their own clock and date", async () => {
    const { clinic, coord, infant, contact } = await family({ timeZone: 'Europe/London' });
    const abroad = { ...contact, name: 'Grandparent Abroad', relation: 'Grandmother', mobile: '+64 21 555 0101', email: 'abroad@test.example', timeZone: 'Pacific/Auckland' };
    await coord.put(`/api/infants/${infant.id}/contacts`).set('X-CSRF-Token', coord.csrf).send({ contacts: [contact, abroad] }).expect(200);
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id, { time: '14:30' }));
    const rows = await ctx.deps.ds.query(`SELECT r.template, r.send_at, c.time_zone FROM reminders r JOIN family_contacts c ON c.id = r.contact_id WHERE r.visit_id = $1 AND r.template NOT IN ${NOTES} ORDER BY r.send_at`, [visit.id]);
    const rules = { dayBeforeAt: '17:00', morningOfAt: '08:00', quietStart: '00:00', quietEnd: '00:00' };
    const startsAt = new Date(visit.startsAt);
    for (const tz of ['Europe/London', 'Pacific/Auckland']) {
      // 14:30 in London is 03:30 the next day in Auckland (UTC+13 in December): each contact's day comes from their clock.
      const expected = planVisitReminders({ ...localParts(startsAt, tz), timeZone: tz, startsAt }, rules, new Date()).map((e) => e.sendAt.toISOString());
      expect(rows.filter((r: { time_zone: string }) => r.time_zone === tz).map((r: { send_at: Date }) => new Date(r.send_at).toISOString())).toEqual(expected);
    }
    expect(localParts(startsAt, 'Pacific/Auckland').date).not.toBe(visit.date);
  });

  it('when a visit is moved, then its pending reminders are cancelled, the family is told at once and new reminders are planned', async () => {
    const { clinic, coord, infant, contact } = await family({ channel: 'email', timeZone: 'Europe/London' });
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    const before = await rowsOf(visit.id);
    const moved = (await coord.patch(`/api/visits/${visit.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: visit.rowVersion, date: future(6), time: '14:15' }).expect(200)).body;
    const after = await rowsOf(visit.id);
    expect(after.filter((r) => before.some((b) => b.id === r.id)).map((r) => [r.status, r.reason])).toEqual([['cancelled', 'visit-changed'], ['cancelled', 'visit-changed']]);
    const note = after.find((r) => r.template === 'visit-moved')!;
    expect(after.filter((r) => r.status === 'scheduled' && r.template !== 'visit-moved').map((r) => r.template).sort()).toEqual(['visit-day-before', 'visit-morning']);
    // The note was due now, so the API put it on the queue itself.
    const [sent] = await settled([note.id]);
    expect(sent.status).toBe('sent');
    const mails = await mailTo(contact.email!);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toContain(`New time for Test's home visit`);
    expect(mails[0].text).toContain(`${moved.time}`);
    expect(mails[0].headers['message-id']).toBe(`<reminder-${note.id}@nestflow.invalid>`);

    // Cancelling: the new reminders go too, and a cancellation note is sent.
    await post(coord, `/api/visits/${visit.id}/cancel`, { reason: 'Family away' }).expect(200);
    const last = await rowsOf(visit.id);
    expect(last.filter((r) => r.status === 'scheduled' && r.template.startsWith('visit-day') )).toHaveLength(0);
    const cancelNote = last.find((r) => r.template === 'visit-cancelled')!;
    await settled([cancelNote.id]);
    expect((await mailTo(contact.email!)).map((m) => m.subject).at(-1)).toMatch(/is cancelled/);
  });

  it('when the family switched from e-mail to text after a reminder was planned, then it goes by text to the number they gave, chosen at send time', async () => {
    const { clinic, coord, infant, contact } = await family({ channel: 'email', timeZone: 'Europe/London' });
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    const [first] = await rowsOf(visit.id);
    // Planned while e-mail was preferred: the log shows e-mail for now.
    expect(first).toMatchObject({ channel: 'email', to_address: contact.email });
    const newMobile = testMobile();
    await ctx.deps.ds.query(`UPDATE family_contacts SET preferred_channel = 'sms', consent_sms = true, mobile = $2 WHERE infant_id = $1`, [infant.id, newMobile]);
    await makeDue([first.id]);
    const [done] = await settled([first.id]);
    expect(done).toMatchObject({ status: 'sent', channel: 'sms', to_address: newMobile });
    expect((await smsTo(newMobile)).map((m) => m.body).join()).toContain('home visit');
    expect(await mailTo(contact.email!)).toHaveLength(0);
  });

  it('when the SMS provider answers 5xx twice, then the message is retried with backoff and sent once on the third attempt', async () => {
    const { clinic, coord, infant, contact } = await family();
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    const [first] = await rowsOf(visit.id);
    await fetch(`http://127.0.0.1:${msg.sms.port}/fail`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ mode: '5xx', count: 2 }) });
    await makeDue([first.id]);
    const [done] = await settled([first.id]);
    expect(done).toMatchObject({ status: 'sent', attempts: 3 });
    expect((await smsTo(contact.mobile!))).toHaveLength(1);
  });

  it('when the SMS provider never answers, then the attempt counts as unknown, the provider is asked, and the message is sent once', async () => {
    const { clinic, coord, infant, contact } = await family();
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    const [first] = await rowsOf(visit.id);
    await fetch(`http://127.0.0.1:${msg.sms.port}/fail`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ mode: 'timeout', count: 1 }) });
    await makeDue([first.id]);
    const timedOut = await waitFor('the time-out to be recorded', async () => (await rowsOf(visit.id)).find((r) => r.id === first.id && r.last_error));
    expect(timedOut.last_error).toMatch(/time/i);
    const [ledger] = await ctx.deps.ds.query(`SELECT state FROM deliveries WHERE reminder_id = $1`, [first.id]);
    expect(ledger.state).toBe('sending');
    // The reconciler (here run by hand, as its scheduler would) picks it up again once the attempt is surely over.
    const done = await waitFor('the retry after the time-out', async () => {
      await reconcileReminders(ctx.deps.repos, msg.queue, msg.jobOptions);
      const [r] = await ctx.deps.ds.query(`SELECT * FROM reminders WHERE id = $1`, [first.id]);
      return r.status === 'sent' && r;
    }, 20_000, 500);
    expect(done.attempts).toBeGreaterThanOrEqual(2);
    expect((await smsTo(contact.mobile!))).toHaveLength(1);
  });

  it('when the SMS provider answers 4xx, then the message fails after one attempt and every coordinator gets an e-mail alert', async () => {
    const { clinic, coord, infant } = await family();
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    const [first] = await rowsOf(visit.id);
    await fetch(`http://127.0.0.1:${msg.sms.port}/fail`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ mode: '4xx', count: 1 }) });
    await makeDue([first.id]);
    const [done] = await settled([first.id]);
    expect(done).toMatchObject({ status: 'failed', attempts: 1 });
    expect(done.last_error).toMatch(/not valid/);
    // The failure joins the coordinator's alert for this period, which goes when the period ends: here, now.
    const [pending] = await ctx.deps.ds.query(`SELECT * FROM reminders WHERE template = 'delivery-failed' AND programme_id = $1`, [clinic.programme.id]);
    expect(pending.data.failures.map((f: { reminderId: string }) => f.reminderId)).toEqual([first.id]);
    await bringForward(ctx.deps, msg.queue, [pending.id]);
    await makeDue([pending.id]);
    const alert = await waitFor('the coordinator alert', async () => {
      const [a] = await ctx.deps.ds.query(`SELECT * FROM reminders WHERE id = $1`, [pending.id]);
      return a?.status === 'sent' && a;
    });
    expect(alert.to_address).toBe(clinic.people.coordinator.email);
    const mail = msg.mail.messages().find((m) => m.envelope.to.includes(clinic.people.coordinator.email));
    expect(mail?.subject).toMatch(/could not be delivered/);
    expect(mail?.text).toContain('The To number is not valid');
    // Sending it again by hand (the message log) goes through now that the provider is well.
    const retried = await post(coord, `/api/messages/${first.id}/retry`, {}).expect(200);
    expect(retried.body.message.status).toBe('scheduled');
    const [again] = await settled([first.id]);
    expect(again.status).toBe('sent');
  });

  it('when an earlier attempt reached the provider but the worker died before writing "sent", then the next attempt finds it and does not send again', async () => {
    const { clinic, coord, infant, contact } = await family();
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    const [first] = await rowsOf(visit.id);
    await ctx.deps.ds.query(`UPDATE reminders SET send_at = now() WHERE id = $1`, [first.id]);
    // What a crash leaves behind: the provider has the message, the ledger says "sending" since a minute ago.
    const claimed = await msg.delivery.deliver(first.id, { finalAttempt: false });
    expect(claimed).toBe('sent');
    await ctx.deps.ds.query(`UPDATE reminders SET status = 'scheduled', provider_id = NULL WHERE id = $1`, [first.id]);
    await ctx.deps.ds.query(`UPDATE deliveries SET state = 'sending', started_at = now() - interval '1 minute' WHERE reminder_id = $1`, [first.id]);
    expect(await msg.delivery.deliver(first.id, { finalAttempt: false })).toBe('recovered');
    expect((await smsTo(contact.mobile!))).toHaveLength(1);
  });

  it('when the family turned reminders off or has no consent, then the reminder is skipped with the reason, and nothing is sent', async () => {
    const { clinic, coord, infant, contact } = await family();
    await ctx.deps.ds.query(`UPDATE family_contacts SET reminders_enabled = false WHERE infant_id = $1`, [infant.id]);
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    const rows = await rowsOf(visit.id);
    expect(rows.map((r) => [r.status, r.reason])).toEqual([['skipped', 'opted-out'], ['skipped', 'opted-out']]);
    // Consent withdrawn after booking: decided again at send time.
    await ctx.deps.ds.query(`UPDATE family_contacts SET reminders_enabled = true, consent_sms = false, consent_email = false WHERE infant_id = $1`, [infant.id]);
    const other = await book(coord, infant.id, visitBody(clinic.people.nurse.id, { date: future(8) }));
    const pending = await rowsOf(other.id);
    expect(pending.map((r) => r.reason)).toEqual(['no-consent', 'no-consent']);
    expect((await smsTo(contact.mobile!))).toHaveLength(0);
  });

  it("when the coordinator edits the family's contacts, then a person who stays keeps their reminder switch and their pending reminders", async () => {
    const { clinic, coord, infant, contact } = await family();
    const visit = await book(coord, infant.id, visitBody(clinic.people.nurse.id));
    await ctx.deps.ds.query(`UPDATE family_contacts SET reminders_enabled = false WHERE infant_id = $1`, [infant.id]);
    const second = { ...contact, name: 'Parent Two', relation: 'Father', mobile: '+44 7700 900955', email: 'two@test.example' };
    await coord.put(`/api/infants/${infant.id}/contacts`).set('X-CSRF-Token', coord.csrf).send({ contacts: [contact, second] }).expect(200);
    const rows: Array<{ id: string; name: string; reminders_enabled: boolean }> = await ctx.deps.ds.query(`SELECT id, name, reminders_enabled FROM family_contacts WHERE infant_id = $1 ORDER BY position`, [infant.id]);
    expect(rows.map((r) => [r.name, r.reminders_enabled])).toEqual([[contact.name, false], ['Parent Two', true]]);
    const pending = await rowsOf(visit.id);
    expect(pending.every((r) => r.contact_id === rows[0].id)).toBe(true);
  });

  it('when the consultant approves a journey, then the family is reminded the day before departure with the flow there and the cylinders', async () => {
    const { approvedBaby } = await import('../helpers/approved-baby');
    const { journeyReminderAt } = await import('@shared/reminders/timing');
    const { clinic, infant, family: familyAgent, consultant } = await approvedBaby(ctx.deps, ctx.app);
    await policyWithoutQuietHours(ctx.deps, clinic.programme.id);
    const departOn = future(3);
    const j = (await post(familyAgent, `/api/infants/${infant.id}/journeys`, { mode: 'road', destinationName: 'Cindermoor Heights', destinationElevationM: 900, departOn, returnOn: future(5), hoursAway: 4 }).expect(201)).body.journey;
    expect((await ctx.deps.ds.query(`SELECT 1 FROM reminders WHERE infant_id = $1 AND template = 'journey-day-before'`, [infant.id])).length).toBe(0);
    const approved = (await post(consultant, `/api/journeys/${j.id}/decision`, { decision: 'approve', rowVersion: j.rowVersion }).expect(200)).body.journey;
    const rows = await ctx.deps.ds.query(`SELECT r.*, c.mobile, c.time_zone AS tz FROM reminders r JOIN family_contacts c ON c.id = r.contact_id WHERE r.infant_id = $1 AND r.template = 'journey-day-before'`, [infant.id]);
    expect(rows).toHaveLength(1);
    expect(new Date(rows[0].send_at).toISOString()).toBe(journeyReminderAt(departOn, rows[0].tz, { dayBeforeAt: '17:00', morningOfAt: '08:00', quietStart: '00:00', quietEnd: '00:00' }).toISOString());
    await makeDue([rows[0].id]);
    const [sent] = await settled([rows[0].id]);
    expect(sent.status).toBe('sent');
    const text = msg.sms.messages().find((m) => m.to === rows[0].mobile.replace(/[^0-9+]/g, ''))?.body ?? '';
    expect(text).toContain('trip to Cindermoor Heights tomorrow');
    expect(text).toContain(`${approved.plan.periods[0].flowLpm} L/min`);
    expect(text).toMatch(/take \d+ × /);
  });

  it('when a proposal and a journey check have waited longer than the policy allows, then the consultant digest lists both', async () => {
    const { approvedBaby } = await import('../helpers/approved-baby');
    const { clinic, infant, family: familyAgent } = await approvedBaby(ctx.deps, ctx.app);
    await policyWithoutQuietHours(ctx.deps, clinic.programme.id);
    await post(familyAgent, `/api/infants/${infant.id}/journeys`, { mode: 'flight', destinationName: 'Saltgate Isles', departOn: future(10), returnOn: future(12), hoursAway: 5 }).expect(201);
    // The journey check planned the consultant's digest in its own transaction.
    const [digest] = await ctx.deps.ds.query(`SELECT * FROM reminders WHERE programme_id = $1 AND template = 'consultant-digest' AND user_id = $2`, [clinic.programme.id, clinic.people.consultant.id]);
    expect(digest).toBeTruthy();
    // Brought forward to now, nothing has waited 24 h yet: the digest would be empty, so it is skipped.
    await ctx.deps.ds.query(`UPDATE reminders SET send_at = now() WHERE id = $1`, [digest.id]);
    expect(await msg.delivery.deliver(digest.id, { finalAttempt: false })).toBe('skipped');
    // A day passes for the journey check.
    await ctx.deps.ds.query(`UPDATE journeys SET created_at = now() - interval '30 hours' WHERE infant_id = $1`, [infant.id]);
    await ctx.deps.ds.query(`UPDATE reminders SET status = 'scheduled', reason = NULL WHERE id = $1`, [digest.id]);
    await makeDue([digest.id]);
    const [sent] = await settled([digest.id]);
    expect(sent.status).toBe('sent');
    const mail = msg.mail.messages().find((m) => m.envelope.to.includes(clinic.people.consultant.email));
    expect(mail?.subject).toBe('Nestflow: 1 waiting for your sign-off for more than 24 hours');
    expect(mail?.text).toContain('journey check for a trip to Saltgate Isles');
  });
});
