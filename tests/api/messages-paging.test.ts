import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { makeClinic } from '../helpers/infants';
import { makeProgramme } from '../helpers/factories';
import { EXACT_TOTAL_LIMIT } from '../../server/db/repositories/infants.repository';
import { countPlanOf } from '../helpers/count-plan';

// The message log pages by position (keyset, server/db/repositories/list-paging.ts): next and previous pages follow
// the sort with ties broken by id, filters and the search narrow every page, another programme's messages never
// appear, and a deep page is read from an index instead of sorting or counting the whole programme.
let ctx: TestContext;
let coord: Agent;
let otherCoord: Agent;
let bigCoord: Agent;
let clinic: Awaited<ReturnType<typeof makeClinic>>;
let other: Awaited<ReturnType<typeof makeClinic>>;
let big: Awaited<ReturnType<typeof makeClinic>>;
const MESSAGES = 90;
const BIG = EXACT_TOTAL_LIMIT + 1500;

// The order each sort promises, written out here on its own (not taken from the code under test).
const ORDER: Record<string, string> = {
  sendAt: 'r.send_at ASC, r.id ASC',
  '-sendAt': 'r.send_at DESC, r.id DESC',
  status: 'r.status ASC, r.send_at DESC, r.id DESC',
  '-status': 'r.status DESC, r.send_at DESC, r.id DESC',
};

/** Twelve babies and `count` messages with many shared send times, statuses, channels and names; a third are staff messages. */
async function addMessages(c: Awaited<ReturnType<typeof makeClinic>>, count: number, babies = 12) {
  await ctx.deps.ds.query(
    `INSERT INTO infants (programme_id, enrol_key, given_name, family_name, sex, birth_date, ga_weeks, ga_days, term_date, birth_weight_g, weight_kg, weight_date,
       site_id, hospital_flow_lpm, hospital_o2_percent, hospital_source, home_source, home_o2_percent, home_address, home_location, home_elevation_m,
       home_pressure_mmhg, nurse_id, consultant_id, status)
     SELECT $1, gen_random_uuid(), 'Wren', 'Hollins ' || g, 'female', DATE '2026-09-01', 27, 3, DATE '2026-11-20', 980, 3, DATE '2026-11-20', $2, 0.25, 100,
       'cylinder', 'cylinder', 100, 'Row ' || g, jsonb_build_object('elevationM', 100), 100, 751.5, $3, $4, 'on_oxygen'
       FROM generate_series(1, $5) g`,
    [c.programme.id, c.site.id, c.people.nurse.id, c.people.consultant.id, babies],
  );
  await ctx.deps.ds.query(
    `WITH b AS (SELECT array_agg(id ORDER BY family_name) AS ids FROM infants WHERE programme_id = $1)
     INSERT INTO reminders (programme_id, infant_id, template, recipient_name, channel, to_address, time_zone, dedupe_key, send_at, status, attempts)
     SELECT $1, CASE WHEN g % 3 = 0 THEN NULL ELSE b.ids[1 + g % array_length(b.ids, 1)] END,
       (ARRAY['visit-booked','visit-day-before','visit-morning','nurse-digest'])[1 + g % 4],
       CASE WHEN g % 3 = 0 THEN 'Nurse Tamsin' ELSE 'Parent ' || (g % 6) END,
       (ARRAY['sms','email'])[1 + g % 2], CASE WHEN g % 2 = 0 THEN '+4477009002' || lpad((g % 50)::text, 2, '0') ELSE 'parent' || (g % 6) || '@test.example' END,
       'Europe/London', 'paging-' || gen_random_uuid(), TIMESTAMPTZ '2026-11-01T09:00:00Z' + (g % 8) * interval '1 hour',
       (ARRAY['scheduled','sent','failed','skipped','cancelled'])[1 + g % 5], 1
       FROM generate_series(1, $2) g, b`,
    [c.programme.id, count],
  );
}

const ids = (body: { items: Array<{ id: string }> }) => body.items.map((i) => i.id);

/** Follows every "next" cursor from the first page; returns the ids in order and each page's body. */
async function walk(agent: Agent, query: string) {
  const pages = [(await agent.get(`/api/messages?${query}`).expect(200)).body];
  while (pages.at(-1).nextCursor) pages.push((await agent.get(`/api/messages?${query}&cursor=${pages.at(-1).nextCursor}`).expect(200)).body);
  return { ids: pages.flatMap(ids), pages };
}

async function expected(programmeId: string, sort: string, where = 'TRUE', params: unknown[] = []): Promise<string[]> {
  const rows = await ctx.deps.ds.query(
    `SELECT r.id FROM reminders r LEFT JOIN infants i ON i.id = r.infant_id WHERE r.programme_id = $1 AND ${where} ORDER BY ${ORDER[sort]}`,
    [programmeId, ...params],
  );
  return rows.map((r: { id: string }) => r.id);
}

beforeAll(async () => {
  ctx = await createTestContext();
  [clinic, other, big] = [await makeClinic(ctx.deps), await makeClinic(ctx.deps), await makeClinic(ctx.deps)];
  await addMessages(clinic, MESSAGES);
  // Another programme's messages share every send time, status and name with the first.
  await addMessages(other, 30);
  await addMessages(big, BIG, 40);
  await ctx.deps.ds.query('ANALYZE reminders');
  await ctx.deps.ds.query('ANALYZE infants');
  [coord, otherCoord, bigCoord] = await Promise.all([clinic, other, big].map((c) => signedInAgent(ctx.app, c.people.coordinator.email)));
}, 60_000);
afterAll(() => ctx.close());

describe('message log paging by position', () => {
  it.each(Object.keys(ORDER))('when every next page is followed for sort %s, then each message appears once, in the sort order with ties broken by id', async (sort) => {
    const want = await expected(clinic.programme.id, sort);
    expect(want).toHaveLength(MESSAGES);
    const { ids: got, pages } = await walk(coord, `sort=${sort}&pageSize=7`);
    expect(got).toEqual(want);
    expect(pages).toHaveLength(Math.ceil(MESSAGES / 7));
    expect(pages[0]).toMatchObject({ total: MESSAGES, totalIsEstimate: false, prevCursor: null });
    expect(pages.at(-1).nextCursor).toBeNull();
  });

  it.each(Object.keys(ORDER))('when "previous" is followed back from the last page for sort %s, then the same pages come back in reverse, down to a first page with no previous', async (sort) => {
    const { pages } = await walk(coord, `sort=${sort}&pageSize=7`);
    let body = pages.at(-1);
    for (let n = pages.length - 2; n >= 0; n--) {
      body = (await coord.get(`/api/messages?sort=${sort}&pageSize=7&cursor=${body.prevCursor}&direction=prev`).expect(200)).body;
      expect(ids(body)).toEqual(ids(pages[n]));
      expect(body.nextCursor).not.toBeNull();
    }
    expect(body.prevCursor).toBeNull();
  });

  it('when a status and a channel filter are paged, then only those messages come, all of them, and the total counts them', async () => {
    const want = await expected(clinic.programme.id, 'status', `r.status = 'failed' AND r.channel = 'email'`);
    expect(want.length).toBeGreaterThan(5);
    const { ids: got, pages } = await walk(coord, 'sort=status&status=failed&channel=email&pageSize=4');
    expect(got).toEqual(want);
    expect(pages[0].total).toBe(want.length);
  });

  it("when the log is searched by a baby's name, a recipient or a phone number as typed, then every page holds only matches, in order", async () => {
    const byBaby = await expected(clinic.programme.id, '-sendAt', `(i.given_name || ' ' || i.family_name) ILIKE '%hollins 1%'`);
    expect(byBaby.length).toBeGreaterThan(5);
    expect((await walk(coord, 'q=hollins%201&pageSize=5')).ids).toEqual(byBaby);

    const byRecipient = await expected(clinic.programme.id, 'sendAt', `r.recipient_name = 'Parent 2' AND r.template = 'visit-morning'`);
    const walked = await walk(coord, 'q=Parent%202&template=visit-morning&sort=sendAt&pageSize=2');
    expect(walked.ids).toEqual(byRecipient);
    expect(walked.pages[0].total).toBe(byRecipient.length);

    // '07700 900204' is how a GB number is written at home; it is stored as +447700900204 (common practice: E.164).
    const byPhone = await expected(clinic.programme.id, '-sendAt', `r.to_address = '+447700900204'`);
    expect(byPhone.length).toBeGreaterThan(0);
    expect((await walk(coord, 'q=07700%20900204&pageSize=1')).ids).toEqual(byPhone);
  });

  it("when a cursor from another programme's log is used, then only the caller's own messages come back, and theirs never appear", async () => {
    const theirs = (await otherCoord.get('/api/messages?sort=sendAt&pageSize=5').expect(200)).body;
    const mine = (await coord.get(`/api/messages?sort=sendAt&pageSize=100&cursor=${theirs.nextCursor}`).expect(200)).body;
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM reminders WHERE id = ANY($1) AND programme_id = $2`, [ids(mine), clinic.programme.id]);
    expect(mine.items.length).toBeGreaterThan(0);
    expect(n).toBe(mine.items.length);
    const theirIds = new Set(await expected(other.programme.id, 'sendAt'));
    expect((await walk(coord, 'sort=sendAt&pageSize=25')).ids.some((id) => theirIds.has(id))).toBe(false);
  });

  it('when the cursor is damaged, belongs to another sort, or the direction is unknown, then 400 names the field and says what to do', async () => {
    const p1 = (await coord.get('/api/messages?sort=sendAt&pageSize=10').expect(200)).body;
    for (const cursor of ['not-a-cursor', Buffer.from('["sendAt",["2026-11-01"],"nope"]').toString('base64url')]) {
      const res = await coord.get(`/api/messages?sort=sendAt&cursor=${cursor}`).expect(400);
      expect(res.body.error.details['query.cursor'][0]).toMatch(/first page/);
      expect(res.body.error.requestId).toEqual(expect.any(String));
    }
    expect((await coord.get(`/api/messages?sort=status&cursor=${p1.nextCursor}`).expect(400)).body.error.details['query.cursor']).toHaveLength(1);
    // Well formed, but its time is no time: PostgreSQL cannot read it, and that is the caller's mistake, not a 500.
    const forged = Buffer.from(JSON.stringify(['sendAt', ['2026-13-45 99:00:00+00'], ids(p1)[0]])).toString('base64url');
    expect((await coord.get(`/api/messages?sort=sendAt&cursor=${forged}`).expect(400)).body.error.details['query.cursor'][0]).toMatch(/first page/);
    expect((await coord.get(`/api/messages?cursor=${p1.nextCursor}&sort=sendAt&direction=up`).expect(400)).body.error.details['query.direction']).toEqual(['Direction is next or prev']);
  });
});

describe('a large message log', () => {
  it('when a coordinator (who reads every baby of the programme) counts the log, then PostgreSQL reads messages only, none of the programme\'s babies', async () => {
    const { nodes } = await countPlanOf(ctx.deps.ds, () => bigCoord.get('/api/messages?status=sent&pageSize=25').expect(200));
    expect(nodes.flatMap((n) => n['Relation Name'] ?? [])).toEqual(['reminders']);
  });

  it('when a name no message has is searched, then the count reads the search indexes, not the programme\'s messages; a baby\'s name still finds its messages', async () => {
    // Autovacuum folds GIN's pending list into the index in service; here the rows were bulk-inserted a moment ago.
    await ctx.deps.ds.query('VACUUM ANALYZE reminders');
    const { answer, nodes } = await countPlanOf(ctx.deps.ds, () => bigCoord.get('/api/messages?q=Quornwick&pageSize=25').expect(200));
    expect(answer.body).toMatchObject({ items: [], total: 0 });
    // The babies' names may be read whole while the programme is small (the caseload's search test covers their index).
    expect(nodes.filter((n) => n['Node Type'] === 'Seq Scan' && n['Relation Name'] === 'reminders')).toEqual([]);
    expect(nodes.map((n) => n['Index Name'])).toEqual(expect.arrayContaining(['reminders_recipient_trgm_idx', 'reminders_address_trgm_idx']));

    const [{ n }] = await ctx.deps.ds.query(
      `SELECT count(*)::int AS n FROM reminders r JOIN infants i ON i.id = r.infant_id WHERE r.programme_id = $1 AND i.family_name = 'Hollins 7'`, [big.programme.id]);
    expect((await bigCoord.get('/api/messages?q=hollins%207&pageSize=25').expect(200)).body.total).toBe(n);
    expect(n).toBeGreaterThan(0);
  });

  it('when a message about a baby names another programme than the baby\'s, then the database refuses it', async () => {
    const [baby] = await ctx.deps.ds.query(`SELECT id FROM infants WHERE programme_id = $1 LIMIT 1`, [big.programme.id]);
    const elsewhere = await makeProgramme(ctx.deps, 'Elsewhere');
    await expect(ctx.deps.ds.query(
      `INSERT INTO reminders (programme_id, infant_id, template, recipient_name, channel, to_address, time_zone, dedupe_key, send_at, status, attempts)
       VALUES ($1, $2, 'visit-booked', 'Someone', 'sms', '+447700900001', 'Europe/London', 'mismatch-' || gen_random_uuid(), now(), 'scheduled', 0)`,
      [elsewhere.id, baby.id],
    )).rejects.toMatchObject({ code: '23503' });
  });

  it(`when more than ${EXACT_TOTAL_LIMIT} messages match, then the total is marked as an estimate near the true count; a narrower filter is exact`, async () => {
    const body = (await bigCoord.get('/api/messages?pageSize=25').expect(200)).body;
    expect(body.totalIsEstimate).toBe(true);
    expect(body.total).toBeGreaterThan(EXACT_TOTAL_LIMIT);
    expect(Math.abs(body.total - BIG) / BIG).toBeLessThan(0.2);
    const failed = (await bigCoord.get('/api/messages?status=failed&pageSize=25').expect(200)).body;
    expect(failed).toMatchObject({ total: BIG / 5, totalIsEstimate: false });
  });

  it.each([
    ['status', {}],
    ['-sendAt', { channel: 'sms' as const }],
    ['sendAt', { status: 'sent' as const }],
  ])('when a deep page is read by cursor (sort %s, filters %o), then it is the right rows and PostgreSQL reads about one page of messages from indexes, sorting none of the log', async (sort, filters) => {
    const where = Object.entries(filters).map(([k, v]) => `r.${k} = '${v}'`).join(' AND ') || 'TRUE';
    const want = await expected(big.programme.id, sort, where);
    const deep = Math.min(4000, Math.floor(want.length / 2));
    const [at] = await ctx.deps.ds.query(`SELECT status, send_at::text AS t, id FROM reminders WHERE id = $1`, [want[deep - 1]]);
    const after = sort.includes('status') ? [at.status, at.t, at.id] : [at.t, at.id];
    const spy = vi.spyOn(ctx.deps.ds, 'query');
    const acl = { sql: 'i.programme_id = :acl0', params: { acl0: big.programme.id } };
    const { rows } = await ctx.deps.repos.reminders.list({ sort: sort as 'status', pageSize: 25, page: 1, direction: 'next', ...filters }, big.programme.id, acl, { after });
    const pageCall = spy.mock.calls.find(([sql]) => /ORDER BY/.test(String(sql)))!;
    spy.mockRestore();
    expect(rows.map((r) => r.id)).toEqual(want.slice(deep, deep + 25));

    const [{ 'QUERY PLAN': plan }] = await ctx.deps.ds.query(`EXPLAIN (ANALYZE, FORMAT JSON) ${pageCall[0]}`, pageCall[1]);
    interface PlanNode { 'Node Type': string; 'Relation Name'?: string; 'Index Name'?: string; 'Actual Rows': number; 'Rows Removed by Filter'?: number; Plans?: PlanNode[] }
    // The page's part of the statement: the count beside it (its one aggregate) is another test's.
    const nodes: PlanNode[] = [];
    const visit = (n: PlanNode) => { if (n['Node Type'] === 'Aggregate') return; nodes.push(n); (n.Plans ?? []).forEach(visit); };
    visit(plan[0].Plan);
    const scans = nodes.filter((n) => n['Relation Name'] === 'reminders');
    expect(scans.length).toBeGreaterThan(0);
    for (const scan of scans) {
      expect(scan['Node Type']).toMatch(/^Index (Only )?Scan$/);
      expect(scan['Index Name']).toMatch(/^reminders_p_/);
      // A few pages' worth of entries at most, not the programme's BIG.
      expect(scan['Actual Rows'] + (scan['Rows Removed by Filter'] ?? 0)).toBeLessThanOrEqual(26 * 4);
    }
    // Only the page itself may be sorted (the union of a mixed-direction sort's branches).
    for (const sortNode of nodes.filter((n) => n['Node Type'] === 'Sort')) expect(sortNode['Actual Rows']).toBeLessThanOrEqual(26 * 2);
  });
});
