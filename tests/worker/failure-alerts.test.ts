import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addReminderJobs } from '../../server/jobs/reminder-jobs';
import { addToFailureAlerts, alertPeriod, type FailureItem } from '../../server/modules/reminders/failure-alerts';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { bringForward, policyWithoutQuietHours, startMessaging, waitFor, type Messaging } from '../helpers/messaging';

// The alert storm: failed family messages are gathered into one e-mail per coordinator per period.
let ctx: TestContext;
let msg: Messaging;
beforeAll(async () => {
  ctx = await createTestContext();
  msg = await startMessaging(ctx.deps, { attempts: 1 });
});
afterAll(async () => {
  await msg?.close();
  await ctx?.close();
});

async function programmeWithBaby() {
  const clinic = await makeClinic(ctx.deps);
  const second = await makeUser(ctx.deps, clinic.programme.id, 'coordinator');
  await policyWithoutQuietHours(ctx.deps, clinic.programme.id);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const infant = (await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(enrolmentBody(clinic)).expect(201)).body;
  return { clinic, second, infantId: infant.id as string };
}

/** `count` family messages due now, each to its own family member by SMS. */
async function dueFamilyMessages(programmeId: string, infantId: string, count: number): Promise<string[]> {
  await ctx.deps.ds.query(
    `INSERT INTO family_contacts (infant_id, programme_id, name, relation, mobile, preferred_channel, consent_sms, consent_email, language, time_zone, position)
     SELECT $1, $2, 'Storm parent ' || n, 'Parent', '+4477009' || lpad(n::text, 5, '0'), 'sms', true, false, 'en', 'Europe/London', 10 + n FROM generate_series(1, $3) AS n`,
    [infantId, programmeId, count]);
  const rows: Array<{ id: string }> = await ctx.deps.ds.query(
    `INSERT INTO reminders (programme_id, infant_id, template, contact_id, recipient_name, channel, to_address, time_zone, data, dedupe_key, send_at)
     SELECT $1, $2, 'visit-moved', c.id, c.name, 'sms', c.mobile, 'Europe/London',
            jsonb_build_object('babyName', 'Storm', 'kind', 'home_visit', 'startsAt', '2030-01-02T10:00:00Z', 'date', '2030-01-02', 'time', '10:00',
                               'timeZone', 'Europe/London', 'staffName', 'Nurse Storm', 'purpose', 'Check'), 'storm-' || c.id, now()
       FROM family_contacts c WHERE c.infant_id = $2 AND c.name LIKE 'Storm parent %' RETURNING id`,
    [programmeId, infantId]);
  return rows.map((r) => r.id);
}

describe('coordinator alerts for failed family messages', () => {
  it('when 20 family messages fail, then each coordinator gets one alert listing all 20', async () => {
    const { clinic, second, infantId } = await programmeWithBaby();
    const ids = await dueFamilyMessages(clinic.programme.id, infantId, 20);
    await fetch(`http://127.0.0.1:${msg.sms.port}/fail`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ mode: '4xx', count: 20 }) });
    // Only these twenty are queued (the reconciler would also pick up other files' due rows, which would use up the failures).
    await addReminderJobs(msg.queue, ids.map((id) => ({ id, send_at: new Date(0) })), msg.jobOptions);
    await waitFor('all 20 to fail', async () => (await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM reminders WHERE id = ANY($1) AND status = 'failed'`, [ids]))[0].n === 20);

    const alerts: Array<{ id: string; user_id: string; data: { failures: FailureItem[] } }> = await ctx.deps.ds.query(
      `SELECT id, user_id, data FROM reminders WHERE template = 'delivery-failed' AND programme_id = $1 ORDER BY user_id`, [clinic.programme.id]);
    expect(alerts.map((a) => a.user_id).sort()).toEqual([clinic.people.coordinator.id, second.id].sort());
    for (const a of alerts) expect(a.data.failures.map((f) => f.reminderId).sort()).toEqual([...ids].sort());

    // The period ends ("time passes"): one e-mail each, naming all twenty families.
    await bringForward(ctx.deps, msg.queue, alerts.map((a) => a.id));
    await waitFor('the alerts to go', async () => (await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM reminders WHERE id = ANY($1) AND status = 'sent'`, [alerts.map((a) => a.id)]))[0].n === 2);
    for (const person of [clinic.people.coordinator, second]) {
      const mails = msg.mail.messages().filter((m) => m.envelope.to.includes(person.email));
      expect(mails).toHaveLength(1);
      expect(mails[0].subject).toBe('Nestflow: 20 family messages could not be delivered');
      for (let n = 1; n <= 20; n += 1) expect(mails[0].text).toContain(`- Storm parent ${n} (`);
    }
  });

  it('when failures fall in two periods, or the alert is already going, then they go into the next alert: none lost, none listed twice', async () => {
    const { clinic, infantId } = await programmeWithBaby();
    const settings = { ...DEFAULT_POLICY_SETTINGS, reminders: { ...DEFAULT_POLICY_SETTINGS.reminders, failureAlertPeriodMinutes: 60 } };
    const item = (n: number): FailureItem => ({ reminderId: `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`, outcome: 'failed', familyName: `F${n}`, babyName: 'B',
      template: 'visit-moved', channel: 'sms', address: '+447700900001', error: 'x', at: '' });
    const r = { programme_id: clinic.programme.id, infant_id: infantId };
    // Fixed instants: 09:10 and 09:50 UTC share a period; 10:05 is the next one.
    const at = (t: string) => new Date(`2026-03-29T${t}:00Z`);
    const add = (n: number, t: string) => ctx.deps.ds.transaction((m) => addToFailureAlerts(ctx.deps.repos, m, r, item(n), settings, at(t)));
    const [a] = await add(1, '09:10');
    const [b] = await add(2, '09:50');
    expect(b.id).toBe(a.id);
    expect(new Date(a.send_at).toISOString()).toBe('2026-03-29T10:00:00.000Z');
    const [c] = await add(3, '10:05');
    expect(c.id).not.toBe(a.id);
    // The 10:00–11:00 alert starts going out (its ledger row exists): a failure at 10:30 joins the next period's alert.
    await ctx.deps.ds.query(`INSERT INTO deliveries (reminder_id, state, channel, to_address, started_at) VALUES ($1, 'sending', 'email', 'x@test.example', now())`, [c.id]);
    const [d] = await add(4, '10:30');
    expect(d.id).not.toBe(c.id);
    expect(new Date(d.send_at).toISOString()).toBe('2026-03-29T12:00:00.000Z');
    const lists = await ctx.deps.ds.query(`SELECT data FROM reminders WHERE id = ANY($1) ORDER BY send_at`, [[a.id, c.id, d.id]]);
    expect(lists.map((l: { data: { failures: FailureItem[] } }) => l.data.failures.map((f) => f.familyName))).toEqual([['F1', 'F2'], ['F3'], ['F4']]);
    // These alerts sit at past instants: call them off so no later test's reconciler sends them.
    await ctx.deps.ds.query(`UPDATE reminders SET status = 'cancelled' WHERE programme_id = $1 AND template = 'delivery-failed' AND status = 'scheduled'`, [clinic.programme.id]);
  });

  it('when the period is 60 minutes, then periods are whole hours of the epoch, the same in every process', () => {
    expect(alertPeriod(new Date('2026-10-25T00:59:59Z'), 60).endsAt.toISOString()).toBe('2026-10-25T01:00:00.000Z');
    expect(alertPeriod(new Date('2026-10-25T01:00:00Z'), 60).endsAt.toISOString()).toBe('2026-10-25T02:00:00.000Z');
    expect(alertPeriod(new Date('2026-10-25T01:00:00Z'), 15, 1).endsAt.toISOString()).toBe('2026-10-25T01:30:00.000Z');
  });
});
