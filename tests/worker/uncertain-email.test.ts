import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDelivery } from '../../server/modules/reminders/delivery';
import { createMailSender } from '../../server/notifications/mail-sender';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { policyWithoutQuietHours, startMessaging, waitFor, type Messaging } from '../helpers/messaging';

// R7 for e-mail: an attempt that may have reached the mail server is settled by asking the mail service's search
// (the fake's GET /search by Message-ID), or, with no search configured, held for a coordinator — never resent blindly.
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

const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);

/** A family who prefers e-mail, with one reminder due now; returns its id and the family's address. */
async function emailReminder() {
  const clinic = await makeClinic(ctx.deps);
  await policyWithoutQuietHours(ctx.deps, clinic.programme.id);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const email = `parent-${Math.random().toString(36).slice(2, 8)}@test.example`;
  const body = enrolmentBody(clinic, { familyEmail: email });
  body.contacts[0] = { ...body.contacts[0], preferredChannel: 'email', consentEmail: true };
  const infant = (await post(coord, '/api/infants', body).expect(201)).body;
  const visit = (await post(coord, `/api/infants/${infant.id}/visits`, { kind: 'home_visit', date: '2030-06-12', time: '10:30', durationMinutes: 45, staffId: clinic.people.nurse.id, purpose: 'Weight' }).expect(201)).body;
  const [first] = await ctx.deps.ds.query(`SELECT id FROM reminders WHERE visit_id = $1 AND template = 'visit-day-before'`, [visit.id]);
  await ctx.deps.ds.query(`UPDATE reminders SET send_at = now() WHERE id = $1`, [first.id]);
  return { id: first.id as string, email, clinic, coord };
}

/** What a crash leaves behind: the ledger says "sending" since a minute ago and the row is still scheduled. */
const crashAfterStart = (id: string) => Promise.all([
  ctx.deps.ds.query(`UPDATE reminders SET status = 'scheduled', provider_id = NULL, sent_at = NULL WHERE id = $1`, [id]),
  ctx.deps.ds.query(`UPDATE deliveries SET state = 'sending', started_at = now() - interval '1 minute' WHERE reminder_id = $1`, [id]),
]);
// The visit's booking note goes at once on its own; these tests are about the reminder after it.
const inbox = (email: string) => msg.mail.messages().filter((m) => m.envelope.to.includes(email) && !/ is booked: /.test(m.subject ?? ''));

describe('an e-mail attempt of unknown outcome', () => {
  it('when the mail server accepted it but the worker died before "sent", then the mail search finds it and it is not sent again', async () => {
    const { id, email } = await emailReminder();
    expect(await msg.delivery.deliver(id, { finalAttempt: false })).toBe('sent');
    await crashAfterStart(id);
    expect(await msg.delivery.deliver(id, { finalAttempt: false })).toBe('recovered');
    expect(inbox(email)).toHaveLength(1);
    const [row] = await ctx.deps.ds.query(`SELECT status, provider_id FROM reminders WHERE id = $1`, [id]);
    expect(row).toEqual({ status: 'sent', provider_id: `<reminder-${id}@nestflow.invalid>` });
  });

  it('when the search has no such message (the attempt never arrived), then it is sent once, with its fixed Message-ID', async () => {
    const { id, email } = await emailReminder();
    await ctx.deps.ds.query(`INSERT INTO deliveries (reminder_id, state, channel, to_address, started_at) VALUES ($1, 'sending', 'email', $2, now() - interval '1 minute')`, [id, email]);
    expect(await msg.delivery.deliver(id, { finalAttempt: false })).toBe('sent');
    expect(inbox(email).map((m) => m.headers['message-id'])).toEqual([`<reminder-${id}@nestflow.invalid>`]);
  });

  it('when no mail search is configured, then it waits as "outcome unknown" in the message log and in the coordinator alert; sending again is the coordinator\'s choice', async () => {
    const { id, email, clinic, coord } = await emailReminder();
    expect(await msg.delivery.deliver(id, { finalAttempt: false })).toBe('sent');
    await crashAfterStart(id);
    const mail = createMailSender({ ...ctx.deps.env, SMTP_HOST: '127.0.0.1', SMTP_PORT: msg.mail.smtpPort, SMTP_SECURE: false, SMTP_USER: undefined, SMTP_PASS: undefined });
    const enqueued: string[] = [];
    const noSearch = createDelivery({ ds: ctx.deps.ds, repos: ctx.deps.repos, logger: ctx.deps.logger, mail, mailSearch: null, enqueue: async (rows) => void enqueued.push(...rows.map((r) => r.id)),
      sms: { send: async () => { throw new Error('no SMS here'); }, findSent: async () => null } });
    expect(await noSearch.deliver(id, { finalAttempt: false })).toBe('held-outcome-unknown');
    // Nothing is resent, and the scheduler will not pick it up again.
    expect(await noSearch.deliver(id, { finalAttempt: false })).toBe('already-done');
    expect(inbox(email)).toHaveLength(1);

    const log = (await coord.get(`/api/messages?status=unknown`).expect(200)).body;
    expect(log.items.map((m: { id: string }) => m.id)).toEqual([id]);
    expect(log.items[0].reason).toBe('Outcome unknown — check before sending again');
    const [alert] = await ctx.deps.ds.query(`SELECT id, user_id, data FROM reminders WHERE template = 'delivery-failed' AND programme_id = $1`, [clinic.programme.id]);
    expect(enqueued).toEqual([alert.id]);
    expect(alert.user_id).toBe(clinic.people.coordinator.id);
    expect(alert.data.failures).toMatchObject([{ reminderId: id, outcome: 'unknown', channel: 'email', address: email }]);

    // The coordinator has checked with the family and sends it again: one more, on purpose.
    expect((await post(coord, `/api/messages/${id}/retry`, {}).expect(200)).body.message.status).toBe('scheduled');
    await waitFor('the message to go again', async () => (await ctx.deps.ds.query(`SELECT status FROM reminders WHERE id = $1`, [id]))[0].status === 'sent');
    expect(inbox(email)).toHaveLength(2);
    mail.close();
  });

  it('when the mail search cannot answer, then the attempt is retried later, and on the last attempt it is held rather than resent', async () => {
    const { id, email } = await emailReminder();
    expect(await msg.delivery.deliver(id, { finalAttempt: false })).toBe('sent');
    await crashAfterStart(id);
    const mail = createMailSender({ ...ctx.deps.env, SMTP_HOST: '127.0.0.1', SMTP_PORT: msg.mail.smtpPort, SMTP_SECURE: false, SMTP_USER: undefined, SMTP_PASS: undefined });
    const down = createDelivery({ ds: ctx.deps.ds, repos: ctx.deps.repos, logger: ctx.deps.logger, mail, enqueue: async () => undefined,
      mailSearch: { findSent: async () => { throw new Error('Mail search unreachable'); } },
      sms: { send: async () => { throw new Error('no SMS here'); }, findSent: async () => null } });
    await expect(down.deliver(id, { finalAttempt: false })).rejects.toThrow(/unreachable/);
    await ctx.deps.ds.query(`UPDATE deliveries SET started_at = now() - interval '1 minute' WHERE reminder_id = $1`, [id]);
    expect(await down.deliver(id, { finalAttempt: true })).toBe('held-outcome-unknown');
    expect(inbox(email)).toHaveLength(1);
    mail.close();
  });
});
