import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import express from 'express';
import request from 'supertest';
import type { QueryConfig } from 'pg';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { makeProgramme, makeUser } from '../helpers/factories';
import { signedInAgent } from '../helpers/agents';
import { createSessionMiddleware, TOUCH_EVERY_MS } from '../../server/auth/session-middleware';
import { createRowEstimates, ESTIMATE_TTL_MS } from '../../server/db/repositories/row-estimates';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

/** Every statement the session pool runs from here on, by its text. */
function watchSessionPool() {
  const seen: string[] = [];
  const pool = ctx.deps.sessionPool;
  const original = pool.query.bind(pool) as (...a: unknown[]) => unknown;
  const spy = vi.spyOn(pool, 'query').mockImplementation(((...args: unknown[]) => {
    const first = args[0] as string | QueryConfig;
    seen.push(typeof first === 'string' ? first : first.text);
    return original(...args);
  }) as never);
  return { seen, stop: () => spy.mockRestore() };
}

describe('session store', () => {
  it('when a signed-in request comes, then its session and its account are read in one statement', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'coordinator');
    const agent = await signedInAgent(ctx.app, u.email);
    const userReads = vi.spyOn(ctx.deps.repos.users, 'findSessionUser');
    const watch = watchSessionPool();
    try {
      const res = await agent.get('/api/session').expect(200);
      expect(res.body.user).toMatchObject({ id: u.id, role: 'coordinator', programmeId: p.id, programmeName: p.name });
      expect(watch.seen.filter((sql) => /FROM session/.test(sql))).toHaveLength(1);
      expect(userReads).not.toHaveBeenCalled();
    } finally {
      watch.stop();
      userReads.mockRestore();
    }
  });

  it('when the account is disabled or its role changes between requests, then the next request sees it at once', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const agent = await signedInAgent(ctx.app, u.email);
    await ctx.deps.ds.query(`UPDATE users SET role = 'consultant' WHERE id = $1`, [u.id]);
    expect((await agent.get('/api/session').expect(200)).body.user.role).toBe('consultant');
    // Straight in the database, without the sign-out the admin's action also does: the read itself must refuse.
    await ctx.deps.ds.query(`UPDATE users SET disabled = true WHERE id = $1`, [u.id]);
    expect((await agent.get('/api/session').expect(200)).body.user).toBeNull();
    await agent.get('/api/infants').expect(401);
  });

  it('when a session is used again within a minute, then its expiry is moved on once, and again after a minute', async () => {
    let at = Date.parse('2026-12-01T09:00:00Z');
    const app = express();
    app.use(createSessionMiddleware(ctx.deps.env, ctx.deps.sessionPool, () => at));
    app.get('/start', (req, res) => { req.session.signedInAt = 1; res.end('ok'); });
    app.get('/use', (_req, res) => { res.end('ok'); });
    const agent = request.agent(app);
    const watch = watchSessionPool();
    try {
      await agent.get('/start').expect(200);
      const touches = () => watch.seen.filter((sql) => /^UPDATE session SET expire/.test(sql)).length;
      await agent.get('/use').expect(200);
      // express-session writes the touch after the answer; let it land.
      await vi.waitFor(() => expect(touches()).toBe(1));
      at += TOUCH_EVERY_MS - 1_000;
      await agent.get('/use').expect(200);
      await agent.get('/use').expect(200);
      await new Promise((r) => setTimeout(r, 50));
      expect(touches()).toBe(1);
      at += 2_000;
      await agent.get('/use').expect(200);
      await vi.waitFor(() => expect(touches()).toBe(2));
    } finally {
      watch.stop();
    }
  });
});

describe('row estimates', () => {
  it('when the same count is estimated again within the window, then PostgreSQL is asked once; after it, again', async () => {
    let at = 0;
    const estimate = createRowEstimates(ctx.deps.ds, () => at);
    const explain = vi.spyOn(ctx.deps.ds, 'query');
    try {
      const first = await estimate('SELECT 1 FROM generate_series(1, $1::int)', [5000]);
      expect(first).toBeGreaterThan(0);
      at += ESTIMATE_TTL_MS - 1;
      expect(await estimate('SELECT 1 FROM generate_series(1, $1::int)', [5000])).toBe(first);
      expect(explain).toHaveBeenCalledTimes(1);
      // Other parameters are another question.
      await estimate('SELECT 1 FROM generate_series(1, $1::int)', [6000]);
      expect(explain).toHaveBeenCalledTimes(2);
      at += 2;
      await estimate('SELECT 1 FROM generate_series(1, $1::int)', [5000]);
      expect(explain).toHaveBeenCalledTimes(3);
    } finally {
      explain.mockRestore();
    }
  });
});
