import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';

// The nurse's "today" comes from the injected clock: 2 Dec 2026 in Europe/London (the factories' programme zone).
const NOW = '2026-12-02T12:00:00.000Z';
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
});
afterAll(() => ctx.close());

async function nurseWithRound() {
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const infant = (await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(enrolmentBody(clinic, {})).expect(201)).body;
  await ctx.deps.ds.query(`DELETE FROM checks WHERE infant_id = $1`, [infant.id]);
  const add = async (key: string, dueAt: string, status = 'planned', doneAt: string | null = null) => {
    const [row] = await ctx.deps.ds.query(
      `INSERT INTO checks (programme_id, infant_id, plan_key, kind, due_at, due_date, status, done_at)
       VALUES ($1, $2, $3, 'spot_check', $4, ($4::timestamptz AT TIME ZONE 'Europe/London')::date, $5, $6) RETURNING id`,
      [clinic.programme.id, infant.id, key, dueAt, status, doneAt],
    );
    return row.id as string;
  };
  await add('overdue', '2026-11-30T10:00:00Z', 'overdue');
  await add('morning', '2026-12-02T09:00:00Z');
  await add('noon', '2026-12-02T12:00:00Z');
  await add('evening', '2026-12-02T17:00:00Z');
  await add('done-yesterday', '2026-12-01T09:00:00Z', 'done', '2026-12-01T09:30:00Z');
  await add('next-week', '2026-12-05T09:00:00Z');
  const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
  return { nurse, infant };
}

const round = (body: { items: Array<{ planKey: string; status: string }> }) => body.items.map((i) => `${i.planKey}:${i.status}`);

describe("the nurse's round", () => {
  it('when checks are done during the day, then they stay in their place, marked done, so the order and numbers never shift', async () => {
    const { nurse, infant } = await nurseWithRound();
    const first = (await nurse.get('/api/my-day').expect(200)).body;
    expect(first.date).toBe('2026-12-02');
    expect(round(first)).toEqual(['overdue:overdue', 'morning:planned', 'noon:planned', 'evening:planned']);

    // Two readings saved during the day complete the overdue and the noon checks.
    await ctx.deps.ds.query(`UPDATE checks SET status = 'done', done_at = '2026-12-02T11:40:00Z' WHERE infant_id = $1 AND plan_key IN ('overdue', 'noon')`, [infant.id]);
    const after = (await nurse.get('/api/my-day').expect(200)).body;
    expect(round(after)).toEqual(['overdue:done', 'morning:planned', 'noon:done', 'evening:planned']);
    expect(after.upcoming.map((i: { planKey: string }) => i.planKey)).toEqual(['next-week']);
  });

  it('when a check was done on an earlier day, or one due later is done early, then it is not on today\'s round or the week ahead', async () => {
    const { nurse, infant } = await nurseWithRound();
    await ctx.deps.ds.query(`UPDATE checks SET status = 'done', done_at = '2026-12-02T10:00:00Z' WHERE infant_id = $1 AND plan_key = 'next-week'`, [infant.id]);
    const day = (await nurse.get('/api/my-day').expect(200)).body;
    expect(round(day)).not.toContain('done-yesterday:done');
    expect(day.upcoming).toEqual([]);
    expect(round(day)).toEqual(['overdue:overdue', 'morning:planned', 'noon:planned', 'evening:planned', 'next-week:done']);
  });
});
