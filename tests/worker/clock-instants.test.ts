import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planDigests } from '../../server/modules/reminders/digests';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { policyWithoutQuietHours, startMessaging, testMobile, type Messaging } from '../helpers/messaging';

// Time-dependent delivery decisions run at fixed instants, never at the hour the suite happens to run: around
// midnight, around noon, and through both clock changes of Europe/London (the programmes' zone). UK clocks go
// forward at 01:00 UTC on the last Sunday of March and back at 01:00 UTC on the last Sunday of October
// (Directive 2000/84/EC, art. 2–3; the Summer Time Order 2002): 2026-03-29 and 2026-10-25.
let ctx: TestContext;
let msg: Messaging;
beforeAll(async () => {
  ctx = await createTestContext();
  msg = await startMessaging(ctx.deps);
});
const programmes: string[] = [];
const planned: string[] = [];
afterAll(async () => {
  // Rows left scheduled at past instants (planDigests plans for every programme in the database) would be due for
  // every later test file's reconciler: call them off.
  await ctx?.deps.ds.query(`UPDATE reminders SET status = 'cancelled', reason = 'no-longer-needed' WHERE (programme_id = ANY($1) OR id = ANY($2)) AND status = 'scheduled'`, [programmes, planned]);
  await msg?.close();
  await ctx?.close();
});

async function clinicWithBaby(opts: { quietHours: boolean; timeZone?: string }) {
  const clinic = await makeClinic(ctx.deps);
  programmes.push(clinic.programme.id);
  if (!opts.quietHours) await policyWithoutQuietHours(ctx.deps, clinic.programme.id);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const body = enrolmentBody(clinic);
  const mobile = testMobile();
  body.contacts[0] = { ...body.contacts[0], timeZone: opts.timeZone ?? 'Europe/London', mobile };
  const infant = (await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(body).expect(201)).body;
  return { clinic, infant, mobile };
}

// Each instant with what London's clock reads then, and when that day's 08:00 digest goes (null: past noon, none).
const DIGEST_INSTANTS = [
  { at: '2026-01-15T06:00:00Z', local: 'winter 06:00 GMT', date: '2026-01-15', sendAt: '2026-01-15T08:00:00.000Z' },
  { at: '2026-03-28T23:59:00Z', local: '23:59 GMT, a minute before midnight', date: null, sendAt: null },
  { at: '2026-03-29T00:30:00Z', local: '00:30 GMT on the day clocks go forward', date: '2026-03-29', sendAt: '2026-03-29T07:00:00.000Z' },
  { at: '2026-07-01T10:59:00Z', local: '11:59 BST, a minute before noon', date: '2026-07-01', sendAt: '2026-07-01T07:00:00.000Z' },
  { at: '2026-07-01T11:01:00Z', local: '12:01 BST, just after noon', date: null, sendAt: null },
  { at: '2026-10-24T23:30:00Z', local: '00:30 BST on the day clocks go back', date: '2026-10-25', sendAt: '2026-10-25T08:00:00.000Z' },
  { at: '2026-10-25T00:30:00Z', local: 'the first 01:30 (BST)', date: '2026-10-25', sendAt: '2026-10-25T08:00:00.000Z' },
  { at: '2026-10-25T01:30:00Z', local: 'the second 01:30 (GMT)', date: '2026-10-25', sendAt: '2026-10-25T08:00:00.000Z' },
];

describe('the nurses\' morning digest at fixed instants', () => {
  it.each(DIGEST_INSTANTS)('when the digests are planned at $local ($at), then the day is $date, sent at $sendAt (null: none after noon), listing the checks due, and dropped after noon', async ({ at, date, sendAt }) => {
    const { clinic, infant } = await clinicWithBaby({ quietHours: false });
    const now = new Date(at);
    planned.push(...(await planDigests(ctx.deps.ds, ctx.deps.repos, now)).map((r) => r.id));
    const rows = await ctx.deps.ds.query(`SELECT * FROM reminders WHERE programme_id = $1 AND template = 'nurse-digest'`, [clinic.programme.id]);
    if (date === null) {
      expect(rows).toEqual([]);
      return;
    }
    expect(rows).toHaveLength(1);
    const [digest] = rows;
    expect(digest.data).toEqual({ date });
    expect(new Date(digest.send_at).toISOString()).toBe(sendAt);
    // Planning again (the scheduler runs often, maybe in two workers) adds nothing.
    expect(await planDigests(ctx.deps.ds, ctx.deps.repos, new Date(now.getTime() + 20 * 60_000))).toEqual([]);

    const due = new Date(Math.max(now.getTime(), Date.parse(sendAt!)));
    // Nothing due that day: skipped, not sent empty.
    expect(await msg.delivery.deliver(digest.id, { finalAttempt: false, now: due })).toBe('skipped');
    await ctx.deps.ds.query(`UPDATE reminders SET status = 'scheduled', reason = NULL WHERE id = $1`, [digest.id]);
    await ctx.deps.ds.query(
      `INSERT INTO checks (programme_id, infant_id, plan_key, kind, due_at, due_date, status) VALUES ($1, $2, 'clock-spot', 'spot_check', $3, $4, 'planned')`,
      [clinic.programme.id, infant.id, due, date],
    );
    // After noon on the digest's own day it is no longer useful: dropped, whatever hour the suite runs at.
    const afterNoon = new Date(Date.parse(`${date}T12:01:00Z`) - (Date.parse(sendAt!) - Date.parse(`${date}T08:00:00Z`)));
    expect(await msg.delivery.deliver(digest.id, { finalAttempt: false, now: afterNoon })).toBe('skipped');
    await ctx.deps.ds.query(`UPDATE reminders SET status = 'scheduled', reason = NULL WHERE id = $1`, [digest.id]);
    expect(await msg.delivery.deliver(digest.id, { finalAttempt: false, now: due })).toBe('sent');
    const mail = msg.mail.messages().find((m) => m.envelope.to.includes(clinic.people.nurse.email));
    const dayText = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', timeZone: 'UTC' }).format(new Date(`${date}T12:00:00Z`));
    expect(mail?.subject).toBe(`Your Nestflow day, ${dayText}: 1 checks, 0 visits`);
    expect(mail?.text).toMatch(/Checks due today or overdue:\r?\n- Test Baby [^:]+: Spot check, due today/);
  });
});

// A change note due at each instant in the family's zone, with the default quiet hours 21:00–08:00 (their clock).
const QUIET_INSTANTS = [
  { at: '2026-03-29T00:30:00Z', tz: 'Europe/London', local: '00:30 GMT before clocks go forward', quiet: true, releasedAt: '2026-03-29T07:00:00.000Z' },
  { at: '2026-10-25T01:30:00Z', tz: 'Europe/London', local: 'the second 01:30 as clocks go back', quiet: true, releasedAt: '2026-10-25T08:00:00.000Z' },
  { at: '2026-06-30T20:59:00Z', tz: 'Europe/London', local: '21:59 BST', quiet: true, releasedAt: '2026-07-01T07:00:00.000Z' },
  { at: '2026-06-30T19:59:00Z', tz: 'Europe/London', local: '20:59 BST, a minute before quiet hours', quiet: false, releasedAt: null },
  { at: '2026-07-01T07:00:00Z', tz: 'Europe/London', local: '08:00 BST, the end of quiet hours', quiet: false, releasedAt: null },
  { at: '2026-07-01T12:00:00Z', tz: 'Pacific/Auckland', local: '00:00 NZST, midnight', quiet: true, releasedAt: '2026-07-01T20:00:00.000Z' },
];

describe('quiet hours at fixed instants', () => {
  it.each(QUIET_INSTANTS)('when a change note falls due at $local in $tz, then it is held until $releasedAt (or goes now when not quiet)', async ({ at, tz, quiet, releasedAt }) => {
    const { clinic, infant, mobile } = await clinicWithBaby({ quietHours: true, timeZone: tz });
    const now = new Date(at);
    const [contact] = await ctx.deps.ds.query(`SELECT id FROM family_contacts WHERE infant_id = $1`, [infant.id]);
    const insert = async (template: string, notAfter: Date | null) => (await ctx.deps.ds.query(
      `INSERT INTO reminders (programme_id, infant_id, template, contact_id, recipient_name, channel, to_address, time_zone, data, dedupe_key, send_at, not_after)
       VALUES ($1, $2, $3, $4, 'Parent One', 'sms', $5, $6, $7, $8, $9, $10) RETURNING id`,
      [clinic.programme.id, infant.id, template, contact.id, mobile, tz,
        JSON.stringify({ babyName: 'Test', kind: 'home_visit', startsAt: new Date(now.getTime() + 86_400_000).toISOString(), date: '2030-01-01', time: '10:00', timeZone: tz, staffName: 'Nurse', purpose: 'Check' }),
        `quiet-${template}-${infant.id}`, now, notAfter],
    ))[0].id as string;
    const note = await insert('visit-moved', null);
    const outcome = await msg.delivery.deliver(note, { finalAttempt: false, now });
    const [row] = await ctx.deps.ds.query(`SELECT status, send_at FROM reminders WHERE id = $1`, [note]);
    if (!quiet) {
      expect(outcome).toBe('sent');
      return;
    }
    expect(outcome).toBe('held-quiet-hours');
    expect(row.status).toBe('scheduled');
    expect(new Date(row.send_at).toISOString()).toBe(releasedAt);
    // A reminder whose last useful moment comes before quiet hours end is skipped, never sent at night.
    const late = await insert('visit-morning', new Date(now.getTime() + 20 * 60_000));
    expect(await msg.delivery.deliver(late, { finalAttempt: false, now })).toBe('skipped');
    const [skipped] = await ctx.deps.ds.query(`SELECT status, reason FROM reminders WHERE id = $1`, [late]);
    expect(skipped).toEqual({ status: 'skipped', reason: 'quiet-hours' });
    expect(msg.sms.messages().filter((m) => m.to === mobile)).toHaveLength(0);
  });
});
