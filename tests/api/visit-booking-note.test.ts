import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localToInstant } from '@shared/schedule/local-time';
import type { Clock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';

// A clock the test moves; the service reads it on every request. London is UTC+0 in December.
let now = new Date('2026-12-02T12:00:00Z');
const clock: Clock = { now: () => new Date(now) };
const london = (date: string, time: string) => localToInstant(date, time, 'Europe/London')!;

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock });
});
afterAll(() => ctx.close());

const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);

async function familyOnSms() {
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const infant = (await post(coord, '/api/infants', enrolmentBody(clinic)).expect(201)).body;
  const book = async (date: string, time: string) =>
    (await post(coord, `/api/infants/${infant.id}/visits`, { kind: 'home_visit', date, time, durationMinutes: 45, staffId: clinic.people.nurse.id, purpose: 'Spot check' }).expect(201)).body;
  return { coord, infant, book };
}
const rowsOf = async (visitId: string) =>
  (await ctx.deps.ds.query(`SELECT template, status, reason, send_at FROM reminders WHERE visit_id = $1 ORDER BY send_at, template`, [visitId]))
    .map((r: { template: string; status: string; reason: string | null; send_at: Date }) => ({ template: r.template, status: r.status, reason: r.reason, sendAt: new Date(r.send_at).toISOString() }));

// Quiet hours 21:00–08:00, day-before 17:00, morning 08:00: the policy defaults.
describe('telling the family a visit was booked', () => {
  it('when a visit is booked for a later day, then a "booked" note goes at once, before the two reminders', async () => {
    now = london('2026-12-02', '12:00');
    const { book } = await familyOnSms();
    const v = await book('2026-12-05', '10:00');
    expect(await rowsOf(v.id)).toEqual([
      { template: 'visit-booked', status: 'scheduled', reason: null, sendAt: now.toISOString() },
      { template: 'visit-day-before', status: 'scheduled', reason: null, sendAt: london('2026-12-04', '17:00').toISOString() },
      { template: 'visit-morning', status: 'scheduled', reason: null, sendAt: london('2026-12-05', '08:00').toISOString() },
    ]);
  });

  it('when a visit is booked for later today, then the family gets a "today at" note at once (the morning reminder has passed)', async () => {
    now = london('2026-12-02', '11:00');
    const { book } = await familyOnSms();
    const v = await book('2026-12-02', '15:00');
    expect(await rowsOf(v.id)).toEqual([{ template: 'visit-today', status: 'scheduled', reason: null, sendAt: now.toISOString() }]);
  });

  it('when a visit for tomorrow morning is booked in the evening quiet hours, then the "today at" note goes at 08:00 in place of the morning reminder', async () => {
    now = london('2026-12-02', '22:30');
    const { book } = await familyOnSms();
    const v = await book('2026-12-03', '10:00');
    expect(await rowsOf(v.id)).toEqual([{ template: 'visit-today', status: 'scheduled', reason: null, sendAt: london('2026-12-03', '08:00').toISOString() }]);
  });

  it('when a visit booked late tonight cannot be announced before it starts, then the note is logged as skipped for quiet hours', async () => {
    now = london('2026-12-02', '21:30');
    const { book } = await familyOnSms();
    const v = await book('2026-12-02', '23:00');
    expect(await rowsOf(v.id)).toEqual([{ template: 'visit-today', status: 'skipped', reason: 'quiet-hours', sendAt: london('2026-12-03', '08:00').toISOString() }]);
  });

  it('when a booked visit is cancelled, then the family had the booking note first and the cancellation follows it', async () => {
    now = london('2026-12-02', '10:00');
    const { coord, book } = await familyOnSms();
    const v = await book('2026-12-02', '16:00');
    now = london('2026-12-02', '10:30');
    await post(coord, `/api/visits/${v.id}/cancel`, { reason: 'Nurse unwell' }).expect(200);
    const rows = await rowsOf(v.id);
    expect(rows.map((r: { template: string }) => r.template)).toEqual(['visit-today', 'visit-cancelled']);
    expect(rows[1]).toMatchObject({ status: 'scheduled', sendAt: now.toISOString() });
  });

  it('when a visit is moved, then no second booking note is written: the "moved" note gives the new time (a booking note not yet sent goes with the old reminders)', async () => {
    now = london('2026-12-02', '12:00');
    const { coord, book } = await familyOnSms();
    const v = await book('2026-12-06', '10:00');
    await coord.patch(`/api/visits/${v.id}`).set('X-CSRF-Token', coord.csrf).send({ rowVersion: v.rowVersion, date: '2026-12-07' }).expect(200);
    const rows = await rowsOf(v.id);
    expect(rows.filter((r: { status: string }) => r.status !== 'cancelled').map((r: { template: string }) => r.template)).toEqual(['visit-moved', 'visit-day-before', 'visit-morning']);
    expect(rows.filter((r: { template: string }) => r.template === 'visit-booked').map((r: { status: string }) => r.status)).toEqual(['cancelled']);
  });
});
