import { randomInt } from 'node:crypto';
import request from 'supertest';
import twilio from 'twilio';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { stubDelivery } from '../helpers/reminders';

// The address the provider is told to call; signatures are made over it, not over the address the request reached.
const WEBHOOK_URL = 'https://nestflow.example/api/webhooks/sms';
const AUTH_TOKEN = 'nestflow-sms-inbound-test-token';
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ INBOUND_WEBHOOK_URL: WEBHOOK_URL, TWILIO_AUTH_TOKEN: AUTH_TOKEN });
});
afterAll(() => ctx.close());

const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);

/**
 * A baby whose one contact has SMS consent and a mobile of its own, typed with spaces. Numbers come from Ofcom's
 * drama range (07700 900xxx), 900400–900499 in this file only: a STOP reaches every contact with the number.
 */
let nextNumber = 900400 + randomInt(0, 50);
async function babyWithMobile() {
  const digits = String(nextNumber++);
  const stored = `+44 7700 ${digits.slice(0, 3)} ${digits.slice(3)}`;
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const body = enrolmentBody(clinic);
  body.contacts[0].mobile = stored;
  const infant = (await post(coord, '/api/infants', body).expect(201)).body;
  return { clinic, coord, infant, stored, e164: `+447700${digits}` };
}

const reply = (from: string, text: string) => ({ AccountSid: ctx.deps.env.TWILIO_ACCOUNT_SID, MessageSid: `SM${'0'.repeat(30)}01`, From: from, To: '+15005550006', Body: text });
const signed = (params: Record<string, string>, signature = twilio.getExpectedTwilioSignature(AUTH_TOKEN, WEBHOOK_URL, params)) =>
  request(ctx.app).post('/api/webhooks/sms').type('form').set('X-Twilio-Signature', signature).send(params);
const contact = async (infantId: string) =>
  (await ctx.deps.ds.query(`SELECT id, consent_sms, row_version FROM family_contacts WHERE infant_id = $1`, [infantId]))[0];
const stopsFor = (infantId: string) =>
  ctx.deps.ds.query(`SELECT actor_id, details FROM audit_events WHERE action = 'contact.sms_stopped' AND entity_id = $1`, [infantId]);

describe('POST /api/webhooks/sms', () => {
  it('when a correctly signed STOP arrives from the number typed with spaces, then SMS consent is withdrawn and audited, with no session or CSRF token', async () => {
    const { infant, e164 } = await babyWithMobile();
    const before = await contact(infant.id);
    const res = await signed(reply(e164, 'STOP')).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/xml/);
    expect(res.text).toBe('<?xml version="1.0" encoding="UTF-8"?><Response></Response>');
    expect(await contact(infant.id)).toEqual({ id: before.id, consent_sms: false, row_version: before.row_version + 1 });
    expect(await stopsFor(infant.id)).toEqual([{ actor_id: null, details: { contactId: before.id, word: 'STOP', messageSid: `SM${'0'.repeat(30)}01` } }]);
  });

  it('when the reply is " unsubscribe " in any case, then it counts as STOP (common practice)', async () => {
    const { infant, e164 } = await babyWithMobile();
    await signed(reply(e164, ' Unsubscribe ')).expect(200);
    expect((await contact(infant.id)).consent_sms).toBe(false);
  });

  it('when the same number is a contact of babies in two programmes, then both stop, and other numbers are untouched', async () => {
    const a = await babyWithMobile();
    const b = await babyWithMobile();
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const body = enrolmentBody(clinic);
    body.contacts[0].mobile = a.e164;
    const same = (await post(coord, '/api/infants', body).expect(201)).body;
    await signed(reply(a.e164, 'STOP')).expect(200);
    expect((await contact(a.infant.id)).consent_sms).toBe(false);
    expect((await contact(same.id)).consent_sms).toBe(false);
    expect((await stopsFor(a.infant.id)).map((r: { details: { contactId: string } }) => r.details.contactId)).toEqual([(await contact(a.infant.id)).id]);
    expect((await stopsFor(same.id)).map((r: { details: { contactId: string } }) => r.details.contactId)).toEqual([(await contact(same.id)).id]);
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM audit_events WHERE action = 'contact.sms_stopped' AND (entity_id IS NULL OR programme_id IS NULL)`);
    expect(n).toBe(0);
    expect(await contact(b.infant.id)).toMatchObject({ consent_sms: true, row_version: 1 });
    expect(await stopsFor(b.infant.id)).toEqual([]);
  });

  it('when the signature is wrong, missing, or made for another body, then 403 and nothing changes', async () => {
    const { infant, e164 } = await babyWithMobile();
    const params = reply(e164, 'STOP');
    expect((await signed(params, 'bm90LWEtc2lnbmF0dXJl').expect(403)).body.error.code).toBe('forbidden');
    await signed(params, twilio.getExpectedTwilioSignature('some-other-token', WEBHOOK_URL, params)).expect(403);
    await signed(params, twilio.getExpectedTwilioSignature(AUTH_TOKEN, 'https://elsewhere.example/api/webhooks/sms', params)).expect(403);
    await signed(params, twilio.getExpectedTwilioSignature(AUTH_TOKEN, WEBHOOK_URL, reply(e164, 'Thanks'))).expect(403);
    await request(ctx.app).post('/api/webhooks/sms').type('form').send(params).expect(403);
    expect(await contact(infant.id)).toMatchObject({ consent_sms: true, row_version: 1 });
    expect(await stopsFor(infant.id)).toEqual([]);
  });

  it('when a signed reply is not a stop word, then nothing changes', async () => {
    const { infant, e164 } = await babyWithMobile();
    for (const text of ['Thanks, see you tomorrow', 'STOP please call me first', 'Yes']) await signed(reply(e164, text)).expect(200);
    expect(await contact(infant.id)).toMatchObject({ consent_sms: true, row_version: 1 });
    expect(await stopsFor(infant.id)).toEqual([]);
  });

  it('when a signed request lacks From, then 400 and nothing changes', async () => {
    const { infant } = await babyWithMobile();
    const params = { AccountSid: ctx.deps.env.TWILIO_ACCOUNT_SID, Body: 'STOP' };
    await signed(params).expect(400);
    expect((await contact(infant.id)).consent_sms).toBe(true);
  });

  it('when the family has stopped texts, then a scheduled SMS reminder is not sent (no other channel agreed: no-consent)', async () => {
    const { clinic, coord, infant, e164 } = await babyWithMobile();
    const visit = (await post(coord, `/api/infants/${infant.id}/visits`, {
      kind: 'home_visit', date: future(3), time: '10:00', durationMinutes: 45, staffId: clinic.people.nurse.id, purpose: 'Spot check and weight',
    }).expect(201)).body;
    const [reminder] = await ctx.deps.ds.query(`SELECT id, send_at, status, channel FROM reminders WHERE visit_id = $1 AND template = 'visit-day-before'`, [visit.id]);
    expect(reminder).toMatchObject({ status: 'scheduled', channel: 'sms' });
    await signed(reply(e164, 'STOP')).expect(200);
    const { delivery, texts, mails } = stubDelivery(ctx.deps);
    expect(await delivery.deliver(reminder.id, { finalAttempt: false, now: new Date(reminder.send_at) })).toBe('skipped');
    expect([texts.length, mails.length]).toEqual([0, 0]);
    const [after] = await ctx.deps.ds.query(`SELECT status, reason FROM reminders WHERE id = $1`, [reminder.id]);
    expect(after).toEqual({ status: 'skipped', reason: 'no-consent' });
  });
});

describe('POST /api/webhooks/sms without a configured address', () => {
  it('when INBOUND_WEBHOOK_URL is not set, then 503 and no signature is trusted', async () => {
    const bare = await createTestContext({ INBOUND_WEBHOOK_URL: '', TWILIO_AUTH_TOKEN: AUTH_TOKEN });
    try {
      const params = { From: '+447700900001', Body: 'STOP' };
      const res = await request(bare.app).post('/api/webhooks/sms').type('form')
        .set('X-Twilio-Signature', twilio.getExpectedTwilioSignature(AUTH_TOKEN, WEBHOOK_URL, params)).send(params).expect(503);
      expect(res.body.error.code).toBe('not_configured');
    } finally {
      await bare.close();
    }
  });
});
