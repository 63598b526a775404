import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import pg from 'pg';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { approvedBaby, post } from '../helpers/approved-baby';
import { signedInAgent, type Agent } from '../helpers/agents';

// SQL statements per request, counted at the driver as the scale bench counts them (docs: "Speed and scale
// targets"): a list page at most 2 (the session with its account, then the page with its count), a baby's record
// or its readings at most 3 (the session, the record, the audit line of the read), a write in one transaction. The session's expiry,
// moved on at most once a minute per session and process (session-middleware.ts), is left out of the count.
let ctx: TestContext;
let sent: string[] = [];
const originalQuery = pg.Client.prototype.query;
beforeAll(async () => {
  ctx = await createTestContext();
  pg.Client.prototype.query = function counted(this: pg.Client, ...args: unknown[]) {
    const first = args[0] as string | { text: string };
    const text = typeof first === 'string' ? first : first.text;
    if (!/^UPDATE session SET expire/.test(text)) sent.push(text.trim());
    return (originalQuery as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof pg.Client.prototype.query;
});
afterAll(async () => {
  pg.Client.prototype.query = originalQuery;
  await ctx.close();
});

async function statementsOf(request: () => Promise<unknown>): Promise<string[]> {
  sent = [];
  await request();
  return sent;
}

describe('SQL statements per request', () => {
  let baby: Awaited<ReturnType<typeof approvedBaby>>;
  let admin: Agent;
  let nurse: Agent;
  beforeAll(async () => {
    baby = await approvedBaby(ctx.deps, ctx.app);
    admin = await signedInAgent(ctx.app, baby.clinic.people.admin.email);
    nurse = await signedInAgent(ctx.app, baby.clinic.people.nurse.email);
  });

  it.each([
    ['the caseload', '/api/infants?status=on_oxygen&sort=-elevation&pageSize=25', 'coord'],
    ['the caseload, searched by name', '/api/infants?q=Baby&pageSize=25', 'coord'],
    ['the message log', '/api/messages?sort=-sendAt&pageSize=25', 'coord'],
    ['People', '/api/users?sort=name&pageSize=10', 'admin'],
  ] as const)('when %s is read, then it costs two statements: the session, then the page with its count', async (_list, url, who) => {
    const agent = who === 'admin' ? admin : baby.coord;
    const statements = await statementsOf(() => agent.get(url).expect(200));
    expect(statements).toHaveLength(2);
    expect(statements[0]).toMatch(/FROM session s/);
    expect(statements[1]).toMatch(/^SELECT c\.k_total, page\.\*/);
  });

  it('when a baby\'s record is read, then it costs three statements: the session, the record and the audit line of the read', async () => {
    const statements = await statementsOf(() => baby.coord.get(`/api/infants/${baby.infant.id}`).expect(200));
    expect(statements).toHaveLength(3);
    expect(statements[2]).toMatch(/^INSERT INTO audit_events/);
  });

  it('when a baby\'s readings are read, then it costs three statements: the session, the baby with its readings, and the audit line of the read', async () => {
    await post(nurse, `/api/infants/${baby.infant.id}/readings`, { takenAt: '2026-11-29T10:00:00Z', spo2: 96, state: 'asleep' }).expect(201);
    const statements = await statementsOf(() => nurse.get(`/api/infants/${baby.infant.id}/readings?from=2026-11-01T00:00:00Z&to=2026-12-01T00:00:00Z`).expect(200));
    expect(statements).toHaveLength(3);
    expect(statements[2]).toMatch(/^INSERT INTO audit_events/);
  });

  it('when a nurse saves a reading, then everything it writes is written in one transaction', async () => {
    const statements = await statementsOf(() => post(nurse, `/api/infants/${baby.infant.id}/readings`, { takenAt: '2026-11-30T10:00:00Z', spo2: 95, state: 'awake' }).expect(201));
    const begins = statements.flatMap((s, n) => (/^START TRANSACTION|^BEGIN/i.test(s) ? [n] : []));
    expect(begins).toHaveLength(1);
    const commit = statements.findIndex((s) => /^COMMIT/i.test(s));
    const writes = statements.flatMap((s, n) => (/^(INSERT|UPDATE|DELETE)\b/i.test(s) ? [n] : []));
    expect(writes.length).toBeGreaterThan(0);
    for (const n of writes) expect(n > begins[0]! && n < commit, statements[n]).toBe(true);
  });
});
