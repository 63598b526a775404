import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { makeProgrammeWithStaff } from '../helpers/factories';

// People pages by position (keyset, server/db/repositories/list-paging.ts): next and previous pages follow the sort
// with ties broken by id, the role filter and the search narrow every page, and another programme's people never
// appear.
let ctx: TestContext;
let admin: Agent;
let otherAdmin: Agent;
let mine: Awaited<ReturnType<typeof makeProgrammeWithStaff>>;
let theirs: Awaited<ReturnType<typeof makeProgrammeWithStaff>>;
const ADDED = 40;
const PEOPLE = ADDED + 5;

// The order each sort promises, written out here on its own (not taken from the code under test).
const ORDER: Record<string, string> = {
  name: 'name ASC, id ASC',
  '-name': 'name DESC, id DESC',
  email: 'email ASC, id ASC',
  '-email': 'email DESC, id DESC',
  role: 'role ASC, name ASC, id ASC',
  '-role': 'role DESC, name DESC, id DESC',
  createdAt: 'created_at ASC, id ASC',
  '-createdAt': 'created_at DESC, id DESC',
};

/** `count` people with many shared names, roles and creation times. */
async function addPeople(programmeId: string, count: number) {
  await ctx.deps.ds.query(
    `INSERT INTO users (programme_id, email, name, role, password_hash, created_at)
     SELECT $1, 'paging-' || gen_random_uuid() || '@test.example', 'Ada Pennick ' || (g % 5),
       (ARRAY['nurse','consultant','coordinator','admin'])[1 + g % 4], NULL, TIMESTAMPTZ '2026-10-01T08:00:00Z' + (g % 3) * interval '1 day'
       FROM generate_series(1, $2) g`,
    [programmeId, count],
  );
}

const ids = (body: { items: Array<{ id: string }> }) => body.items.map((i) => i.id);

async function walk(agent: Agent, query: string) {
  const pages = [(await agent.get(`/api/users?${query}`).expect(200)).body];
  while (pages.at(-1).nextCursor) pages.push((await agent.get(`/api/users?${query}&cursor=${pages.at(-1).nextCursor}`).expect(200)).body);
  return { ids: pages.flatMap(ids), pages };
}

async function expected(programmeId: string, sort: string, where = 'TRUE'): Promise<string[]> {
  const rows = await ctx.deps.ds.query(`SELECT id FROM users WHERE programme_id = $1 AND ${where} ORDER BY ${ORDER[sort]}`, [programmeId]);
  return rows.map((r: { id: string }) => r.id);
}

beforeAll(async () => {
  ctx = await createTestContext();
  [mine, theirs] = [await makeProgrammeWithStaff(ctx.deps), await makeProgrammeWithStaff(ctx.deps)];
  await addPeople(mine.programme.id, ADDED);
  await addPeople(theirs.programme.id, 12);
  [admin, otherAdmin] = await Promise.all([mine, theirs].map((p) => signedInAgent(ctx.app, p.people.admin.email)));
}, 30_000);
afterAll(() => ctx.close());

describe('People paging by position', () => {
  it.each(Object.keys(ORDER))('when every next page is followed for sort %s, then each person appears once, in the sort order with ties broken by id', async (sort) => {
    const want = await expected(mine.programme.id, sort);
    expect(want).toHaveLength(PEOPLE);
    const { ids: got, pages } = await walk(admin, `sort=${sort}&pageSize=6`);
    expect(got).toEqual(want);
    expect(pages).toHaveLength(Math.ceil(PEOPLE / 6));
    expect(pages[0]).toMatchObject({ total: PEOPLE, totalIsEstimate: false, prevCursor: null });
    expect(pages.at(-1).nextCursor).toBeNull();
  });

  it.each(['role', '-createdAt'])('when "previous" is followed back from the last page for sort %s, then the same pages come back in reverse', async (sort) => {
    const { pages } = await walk(admin, `sort=${sort}&pageSize=6`);
    let body = pages.at(-1);
    for (let n = pages.length - 2; n >= 0; n--) {
      body = (await admin.get(`/api/users?sort=${sort}&pageSize=6&cursor=${body.prevCursor}&direction=prev`).expect(200)).body;
      expect(ids(body)).toEqual(ids(pages[n]));
    }
    expect(body.prevCursor).toBeNull();
  });

  it('when a role filter and a search are paged, then every page holds only matches, all of them, and the total counts them', async () => {
    const want = await expected(mine.programme.id, '-email', `role = 'nurse' AND name ILIKE '%pennick%'`);
    expect(want.length).toBeGreaterThan(3);
    const { ids: got, pages } = await walk(admin, 'sort=-email&role=nurse&q=pennick&pageSize=3');
    expect(got).toEqual(want);
    expect(pages[0].total).toBe(want.length);
    expect(pages[0].items[0]).toMatchObject({ role: 'nurse', passwordSet: false, disabled: false, programmeId: mine.programme.id, lastSignInAt: null });
  });

  it("when a cursor from another programme's People is used, then only the caller's own people come back", async () => {
    const other = (await otherAdmin.get('/api/users?sort=name&pageSize=3').expect(200)).body;
    const page = (await admin.get(`/api/users?sort=name&pageSize=100&cursor=${other.nextCursor}`).expect(200)).body;
    expect(page.items.length).toBeGreaterThan(0);
    expect(page.items.every((u: { programmeId: string }) => u.programmeId === mine.programme.id)).toBe(true);
    const theirIds = new Set(await expected(theirs.programme.id, 'name'));
    expect((await walk(admin, 'sort=name&pageSize=20')).ids.some((id) => theirIds.has(id))).toBe(false);
  });

  it('when the cursor is damaged or belongs to another sort, then 400 names the cursor and says what to do', async () => {
    const p1 = (await admin.get('/api/users?sort=role&pageSize=5').expect(200)).body;
    for (const cursor of ['not-a-cursor', Buffer.from('["role",["nurse"],"00000000-0000-4000-8000-000000000000"]').toString('base64url')]) {
      const res = await admin.get(`/api/users?sort=role&cursor=${cursor}`).expect(400);
      expect(res.body.error.details['query.cursor'][0]).toMatch(/first page/);
    }
    expect((await admin.get(`/api/users?sort=name&cursor=${p1.nextCursor}`).expect(400)).body.error.details['query.cursor']).toHaveLength(1);
    // Well formed, but its date is no date: PostgreSQL cannot read it, and that is the caller's mistake, not a 500.
    const forged = Buffer.from(JSON.stringify(['-createdAt', ['yesterday-ish'], ids(p1)[0]])).toString('base64url');
    expect((await admin.get(`/api/users?sort=-createdAt&cursor=${forged}`).expect(400)).body.error.details['query.cursor'][0]).toMatch(/first page/);
  });
});
