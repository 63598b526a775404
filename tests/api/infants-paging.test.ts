import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { makeClinic } from '../helpers/infants';
import { EXACT_TOTAL_LIMIT } from '../../server/db/repositories/infants.repository';
import { countPlanOf } from '../helpers/count-plan';

// The caseload pages by position (keyset): next and previous pages follow the sort with ties broken by id, no
// row is skipped or repeated, the total is exact up to EXACT_TOTAL_LIMIT and an estimate above, and a page is read
// from an index without sorting or counting the whole programme.
let ctx: TestContext;
let coord: Agent;
let bigCoord: Agent;
let clinic: Awaited<ReturnType<typeof makeClinic>>;
let bigProgrammeId: string;
const SMALL = 63;
const BIG = EXACT_TOTAL_LIMIT + 1200;

/** `count` babies with deliberately repeated sort values (names, dates and pressures shared by many). */
async function addBabies(c: Awaited<ReturnType<typeof makeClinic>>, count: number) {
  await ctx.deps.ds.query(
    `INSERT INTO infants (programme_id, enrol_key, given_name, family_name, sex, birth_date, ga_weeks, ga_days, term_date, birth_weight_g, weight_kg, weight_date,
       site_id, hospital_flow_lpm, hospital_o2_percent, hospital_source, home_source, home_o2_percent, home_address, home_location, home_elevation_m,
       home_pressure_mmhg, nurse_id, consultant_id, status, created_at)
     SELECT $1, gen_random_uuid(), 'Baby ' || (g % 7), 'Paging ' || (g % 11), 'female', DATE '2026-09-01' - (g % 5), 24 + g % 12, g % 7, DATE '2026-12-01' - (g % 5), 900 + g % 900,
       2.5, DATE '2026-11-20', $2, 0.25, 100, 'cylinder', 'concentrator', 95, 'Row ' || g, jsonb_build_object('elevationM', (g % 4) * 100), (g % 4) * 100,
       760 - (g % 4) * 8.5, $3, $4, (ARRAY['on_oxygen','awaiting_signoff','stepping_down','off_oxygen'])[1 + g % 4], TIMESTAMPTZ '2026-11-01T00:00:00Z' + (g % 9) * interval '1 day'
       FROM generate_series(1, $5) g`,
    [c.programme.id, c.site.id, c.people.nurse.id, c.people.consultant.id, count],
  );
}

interface PageBody { items: Array<{ id: string }>; total: number; totalIsEstimate?: boolean; nextCursor: string | null; prevCursor: string | null }
interface PlanNode { 'Node Type': string; 'Actual Rows': number; 'Index Name'?: string; 'Rows Removed by Filter'?: number; Plans?: PlanNode[] }

async function walk(agent: Agent, query: string): Promise<{ ids: string[]; pages: number; lastBody: PageBody }> {
  const ids: string[] = [];
  let body: PageBody = (await agent.get(`/api/infants?${query}`).expect(200)).body;
  let pages = 1;
  ids.push(...body.items.map((i: { id: string }) => i.id));
  while (body.nextCursor) {
    body = (await agent.get(`/api/infants?${query}&cursor=${body.nextCursor}`).expect(200)).body;
    ids.push(...body.items.map((i: { id: string }) => i.id));
    pages++;
  }
  return { ids, pages, lastBody: body };
}

beforeAll(async () => {
  ctx = await createTestContext();
  clinic = await makeClinic(ctx.deps);
  await addBabies(clinic, SMALL);
  coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const big = await makeClinic(ctx.deps);
  await addBabies(big, BIG);
  bigProgrammeId = big.programme.id;
  await ctx.deps.ds.query('ANALYZE infants');
  bigCoord = await signedInAgent(ctx.app, big.people.coordinator.email);
}, 60_000);
afterAll(() => ctx.close());

describe('caseload paging by position', () => {
  it.each(['name', '-name', 'correctedAge', '-elevation', 'status', 'enrolled'])('when every next page is followed for sort %s, then each baby appears once, in the same order as one whole sorted list', async (sort) => {
    const { ids, pages, lastBody } = await walk(coord, `sort=${sort}&pageSize=10`);
    expect(pages).toBe(7);
    expect(ids).toHaveLength(SMALL);
    expect(new Set(ids).size).toBe(SMALL);
    expect(lastBody.nextCursor).toBeNull();
    // The same order read in one request (the API allows up to 100 rows a page).
    const whole = (await coord.get(`/api/infants?sort=${sort}&pageSize=100`).expect(200)).body;
    expect(whole.items.map((i: { id: string }) => i.id)).toEqual(ids);
    expect(whole).toMatchObject({ total: SMALL, totalIsEstimate: false, prevCursor: null, nextCursor: null });
  });

  it('when "previous" is followed from the third page, then it is exactly the second page, and the first page has no previous', async () => {
    const p1 = (await coord.get('/api/infants?sort=-elevation&pageSize=10').expect(200)).body;
    expect(p1.prevCursor).toBeNull();
    const p2 = (await coord.get(`/api/infants?sort=-elevation&pageSize=10&cursor=${p1.nextCursor}`).expect(200)).body;
    const p3 = (await coord.get(`/api/infants?sort=-elevation&pageSize=10&cursor=${p2.nextCursor}`).expect(200)).body;
    const back = (await coord.get(`/api/infants?sort=-elevation&pageSize=10&cursor=${p3.prevCursor}&direction=prev`).expect(200)).body;
    expect(back.items.map((i: { id: string }) => i.id)).toEqual(p2.items.map((i: { id: string }) => i.id));
    const first = (await coord.get(`/api/infants?sort=-elevation&pageSize=10&cursor=${back.prevCursor}&direction=prev`).expect(200)).body;
    expect(first.items.map((i: { id: string }) => i.id)).toEqual(p1.items.map((i: { id: string }) => i.id));
    expect(first.prevCursor).toBeNull();
    expect(first.nextCursor).not.toBeNull();
  });

  it('when a status filter is paged, then only that status is listed and the total counts it', async () => {
    const { ids } = await walk(coord, 'status=stepping_down&sort=name&pageSize=5');
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM infants WHERE programme_id = $1 AND status = 'stepping_down'`, [clinic.programme.id]);
    expect(ids).toHaveLength(n);
    expect((await coord.get('/api/infants?status=stepping_down&pageSize=5').expect(200)).body.total).toBe(n);
  });

  it('when a page number is given instead of a cursor, then the same rows come as by walking', async () => {
    const { ids } = await walk(coord, 'sort=correctedAge&pageSize=10');
    const p3 = (await coord.get('/api/infants?sort=correctedAge&pageSize=10&page=3').expect(200)).body;
    expect(p3.items.map((i: { id: string }) => i.id)).toEqual(ids.slice(20, 30));
    expect(p3.prevCursor).not.toBeNull();
  });

  it('when a page number past the last page is asked for, then the page is empty and still says how many babies match', async () => {
    // The page and its count are one statement (list-paging.ts): an empty page must not lose the count.
    const past = (await coord.get('/api/infants?sort=name&pageSize=10&page=50').expect(200)).body;
    expect(past).toMatchObject({ items: [], total: SMALL, totalIsEstimate: false, nextCursor: null });
  });

  it('when the cursor is damaged or belongs to another sort, then 400 names the cursor and says what to do', async () => {
    const p1 = (await coord.get('/api/infants?sort=name&pageSize=10').expect(200)).body;
    for (const cursor of ['not-a-cursor', Buffer.from('["name",["x"],"nope"]').toString('base64url')]) {
      const res = await coord.get(`/api/infants?sort=name&cursor=${cursor}`).expect(400);
      expect(res.body.error.details['query.cursor'][0]).toMatch(/first page/);
    }
    await coord.get(`/api/infants?sort=enrolled&cursor=${p1.nextCursor}`).expect(400);
    // Well formed, but its date is no date: PostgreSQL cannot read it, and that is the caller's mistake, not a 500.
    const forged = Buffer.from(JSON.stringify(['correctedAge', ['2026-02-31'], p1.items[0].id])).toString('base64url');
    expect((await coord.get(`/api/infants?sort=correctedAge&cursor=${forged}`).expect(400)).body.error.details['query.cursor'][0]).toMatch(/first page/);
    expect((await coord.get(`/api/infants?sort=name&cursor=${p1.nextCursor}&direction=sideways`).expect(400)).body.error.details['query.direction']).toEqual(['Direction is next or prev']);
  });

  it("when a cursor from another programme's list is used, then only the caller's own babies come back", async () => {
    const theirs = (await bigCoord.get('/api/infants?sort=name&pageSize=10').expect(200)).body;
    const mine = (await coord.get(`/api/infants?sort=name&pageSize=100&cursor=${theirs.nextCursor}`).expect(200)).body;
    const [{ n }] = await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM infants WHERE id = ANY($1) AND programme_id = $2`, [mine.items.map((i: { id: string }) => i.id), clinic.programme.id]);
    expect(n).toBe(mine.items.length);
  });
});

describe('a large programme', () => {
  it(`when more than ${EXACT_TOTAL_LIMIT} babies match, then the total is marked as an estimate near the true count`, async () => {
    const body = (await bigCoord.get('/api/infants?pageSize=25').expect(200)).body;
    expect(body.totalIsEstimate).toBe(true);
    expect(body.total).toBeGreaterThan(EXACT_TOTAL_LIMIT);
    expect(Math.abs(body.total - BIG) / BIG).toBeLessThan(0.2);
    const filtered = (await bigCoord.get('/api/infants?status=off_oxygen&pageSize=25').expect(200)).body;
    expect(filtered).toMatchObject({ total: Math.floor(BIG / 4), totalIsEstimate: false });
  });

  it('when a deep page is read by cursor, then PostgreSQL reads about one page of babies from an index, with no sort of the programme', async () => {
    const { rows } = await ctx.deps.repos.infants.list(
      { sort: '-elevation', status: 'on_oxygen', pageSize: 25, page: 1, direction: 'next' },
      { sql: 'i.programme_id = :p', params: { p: (await ctx.deps.ds.query(`SELECT programme_id FROM users WHERE email = $1`, [(await bigCoord.get('/api/session')).body.user.email]))[0].programme_id } },
      undefined, {},
    );
    expect(rows).toHaveLength(25);
    const programmeId = (await ctx.deps.ds.query(`SELECT programme_id FROM infants WHERE id = $1`, [rows[0]!.id]))[0].programme_id;
    const [{ 'QUERY PLAN': plan }] = await ctx.deps.ds.query(
      `EXPLAIN (ANALYZE, FORMAT JSON) SELECT i.id FROM infants i WHERE i.programme_id = $1 AND i.status = 'on_oxygen'
         AND (i.home_pressure_mmhg, i.id) > (CAST($2 AS numeric), CAST($3 AS uuid)) ORDER BY i.home_pressure_mmhg ASC, i.id ASC LIMIT 26`,
      [programmeId, rows.at(-1)!.k_pressure, rows.at(-1)!.id],
    );
    const nodes: PlanNode[] = [];
    const visit = (n: PlanNode) => { nodes.push(n); (n.Plans ?? []).forEach(visit); };
    visit(plan[0].Plan);
    expect(nodes.map((n) => n['Node Type'])).not.toContain('Sort');
    // Either pressure index may be chosen (with the status as an index condition or a filter); both read a few
    // pages' worth of entries at most, not the programme's ${BIG}.
    const scan = nodes.find((n) => n['Index Name']);
    expect(scan?.['Index Name']).toMatch(/^infants_p_(status_)?pressure_idx$/);
    expect(scan!['Actual Rows'] + (scan!['Rows Removed by Filter'] ?? 0)).toBeLessThanOrEqual(26 * 8);
  });
});

describe('searching a large programme by name', () => {
  const countOf = async (where: string, params: unknown[]) =>
    (await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM infants WHERE programme_id = $1 AND ${where}`, [bigProgrammeId, ...params]))[0].n as number;

  it('when a name no baby has is searched, then the count is answered from the name index without reading the programme\'s babies', async () => {
    const { answer, nodes } = await countPlanOf(ctx.deps.ds, () => bigCoord.get('/api/infants?q=Quillon&pageSize=25').expect(200));
    expect(answer.body).toMatchObject({ items: [], total: 0 });
    expect(nodes.map((n) => n['Index Name'])).toContain('infants_full_name_trgm_idx');
    expect(nodes.filter((n) => n['Node Type'] === 'Seq Scan')).toEqual([]);
  });

  it('when part of a family name, or a given and a family name together, is searched, then exactly their babies are counted and listed', async () => {
    const family = (await bigCoord.get(`/api/infants?q=${encodeURIComponent('aging 10')}&pageSize=25`).expect(200)).body;
    expect(family.total).toBe(await countOf(`family_name = 'Paging 10'`, []));
    expect(family.total).toBeGreaterThan(25);
    const both = (await bigCoord.get(`/api/infants?q=${encodeURIComponent('baby 3 paging 4')}&pageSize=25`).expect(200)).body;
    expect(both.total).toBe(await countOf(`given_name = 'Baby 3' AND family_name = 'Paging 4'`, []));
    expect(both.total).toBeGreaterThan(0);
    const { ids } = await walk(bigCoord, `q=${encodeURIComponent('baby 3 paging 4')}&pageSize=25`);
    expect(ids).toHaveLength(both.total);
  });
});
