import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import pg, { type QueryConfig } from 'pg';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { makeProgrammeWithStaff } from '../helpers/factories';
import { signedInAgent } from '../helpers/agents';
import { poolOf, preparedRows, statementName } from '../../server/db/repositories/prepared';

// The statements every signed-in request and every caseload page run are prepared once per connection
// (server/db/repositories/prepared.ts): PostgreSQL plans them once, then only binds and runs them.
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

/** The statement names each pool call used (undefined for an unprepared one), with the text's start. */
function watch(pool: pg.Pool) {
  const calls: Array<{ name: string | undefined; text: string }> = [];
  const original = pool.query.bind(pool) as (...a: unknown[]) => unknown;
  const spy = vi.spyOn(pool, 'query').mockImplementation(((...args: unknown[]) => {
    const first = args[0] as string | QueryConfig;
    calls.push(typeof first === 'string' ? { name: undefined, text: first } : { name: first.name, text: first.text });
    return original(...args);
  }) as never);
  return { calls, stop: () => spy.mockRestore() };
}

describe('prepared statements', () => {
  it('when the same text is named twice, then it gets the same name; another text gets another', () => {
    const a = 'SELECT 1 FROM infants i WHERE i.programme_id = $1';
    expect(statementName(a)).toBe(statementName(`${a}`));
    expect(statementName(a)).toMatch(/^nf_[0-9a-f]{20}$/);
    expect(statementName(a)).not.toBe(statementName(`${a} AND i.status = $2`));
  });

  it('when a statement runs twice on one connection, then PostgreSQL holds it prepared once and answers both', async () => {
    const pool = new pg.Pool({ connectionString: ctx.deps.env.DATABASE_URL, max: 1 });
    try {
      const text = 'SELECT $1::int + 1 AS n';
      expect(await preparedRows<{ n: number }>(pool, text, [1])).toEqual([{ n: 2 }]);
      expect(await preparedRows<{ n: number }>(pool, text, [41])).toEqual([{ n: 42 }]);
      const held = await pool.query(`SELECT name, statement FROM pg_prepared_statements WHERE name LIKE 'nf\\_%'`);
      expect(held.rows).toEqual([{ name: statementName(text), statement: text }]);
    } finally {
      await pool.end();
    }
  });

  it('when a coordinator turns the caseload, then the session read and the page with its count are prepared statements, two in all', async () => {
    const { people } = await makeProgrammeWithStaff(ctx.deps);
    const agent = await signedInAgent(ctx.app, people.coordinator.email);
    const sessions = watch(ctx.deps.sessionPool);
    const reads = watch(poolOf(ctx.deps.ds));
    try {
      await agent.get('/api/infants?status=on_oxygen&sort=-elevation&pageSize=25').expect(200);
      const sessionRead = sessions.calls.find((c) => /FROM session s/.test(c.text));
      const page = reads.calls.find((c) => /FROM infants i LEFT JOIN users n/.test(c.text));
      expect(page?.text).toMatch(/^SELECT c\.k_total, page\.\* FROM \(SELECT count\(\*\)::int AS k_total FROM \(SELECT 1 FROM infants i/);
      for (const call of [sessionRead, page]) expect(call?.name).toBe(statementName(call!.text));
      // One read of the session (its expiry may also be moved on, a write of its own) and one of the page.
      expect(sessions.calls.filter((c) => !/^UPDATE session SET expire/.test(c.text))).toHaveLength(1);
      expect(reads.calls).toHaveLength(1);
    } finally {
      sessions.stop();
      reads.stop();
    }
  });
});
