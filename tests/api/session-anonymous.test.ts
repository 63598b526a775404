import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { makeProgramme, makeUser, TEST_PASSWORD } from '../helpers/factories';
import { anonymousAgent } from '../helpers/agents';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const sessionRows = async () => Number((await ctx.deps.ds.query(`SELECT count(*)::int AS n FROM session`))[0].n);

describe('signed-out visitors store no session', () => {
  it('when 50 signed-out visitors ask for the session, then no session row is stored and no session cookie is set', async () => {
    const before = await sessionRows();
    for (let i = 0; i < 50; i++) {
      const res = await request(ctx.app).get('/api/session').expect(200);
      expect(res.body.user).toBeNull();
      expect(res.body.csrfToken).toMatch(/^[0-9a-f]{64}$/);
      expect(String(res.headers['set-cookie'] ?? '')).not.toMatch(/nestflow\.sid=/);
    }
    expect(await sessionRows()).toBe(before);
  });

  it('when one visitor asks twice, then the token stays the same (the form token does not go stale)', async () => {
    const a = await anonymousAgent(ctx.app);
    const again = await a.get('/api/session').expect(200);
    expect(again.body.csrfToken).toBe(a.csrf);
  });

  it('when signing in without the token, with a wrong one, or with a token but not its cookie, then 403', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const a = await anonymousAgent(ctx.app);
    const body = { email: u.email, password: TEST_PASSWORD };
    expect((await a.post('/api/session').send(body)).status).toBe(403);
    expect((await a.post('/api/session').set('X-CSRF-Token', 'f'.repeat(64)).send(body)).status).toBe(403);
    // Another visitor's valid token without that visitor's cookie (a cross-site form cannot send our cookie's pair).
    const noCookie = await request(ctx.app).post('/api/session').set('X-CSRF-Token', a.csrf).send(body);
    expect(noCookie.status).toBe(403);
    expect(noCookie.body.error.code).toBe('csrf_invalid');
  });

  it('when the cookie is edited to carry a token of the caller\'s choosing, then its signature fails and the answer is 403', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const forged = 'a'.repeat(64);
    const res = await request(ctx.app)
      .post('/api/session')
      .set('Cookie', `nestflow.csrf=${forged}.bm90LXRoZS1zaWduYXR1cmU`)
      .set('X-CSRF-Token', forged)
      .send({ email: u.email, password: TEST_PASSWORD });
    expect(res.status).toBe(403);
  });

  it('when signing in with the token, then exactly one session row appears and the new token works for writes', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'admin');
    const a = await anonymousAgent(ctx.app);
    const before = await sessionRows();
    const res = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: u.email, password: TEST_PASSWORD }).expect(200);
    expect(await sessionRows()).toBe(before + 1);
    expect(res.body.csrfToken).not.toBe(a.csrf);
    // The pre-session token is no longer accepted once signed in; the session's own token is.
    expect((await a.post('/api/users').set('X-CSRF-Token', a.csrf).send({})).status).toBe(403);
    expect((await a.post('/api/users').set('X-CSRF-Token', res.body.csrfToken).send({})).status).toBe(400);
  });
});
