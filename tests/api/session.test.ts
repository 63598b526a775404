import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { makeProgramme, makeUser, TEST_PASSWORD } from '../helpers/factories';
import { anonymousAgent, signedInAgent } from '../helpers/agents';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ SIGNIN_PAIR_LIMIT: '3' });
});
afterAll(() => ctx.close());

const GENERIC = 'That e-mail and password do not match an active account.';

describe('sign-in', () => {
  it('when the password is right, then the user comes back and the session is signed in', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const agent = await signedInAgent(ctx.app, u.email);
    const res = await agent.get('/api/session').expect(200);
    expect(res.body.user).toMatchObject({ id: u.id, email: u.email, role: 'nurse', programmeId: p.id, programmeName: p.name });
    const stored = await ctx.deps.repos.users.findByEmail(u.email);
    expect(stored?.lastSignInAt).toBeInstanceOf(Date);
  });

  it('when signing in, then the session id changes (no fixation) and cookies are HttpOnly and SameSite=Lax', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'coordinator');
    const agent = request.agent(ctx.app);
    const first = await agent.get('/api/session').expect(200);
    const before = String(first.headers['set-cookie']);
    const res = await agent.post('/api/session').set('X-CSRF-Token', first.body.csrfToken).send({ email: u.email, password: TEST_PASSWORD }).expect(200);
    const after = String(res.headers['set-cookie']);
    expect(after).toMatch(/HttpOnly/);
    expect(after).toMatch(/SameSite=Lax/);
    expect(after.split(';')[0]).not.toBe(before.split(';')[0]);
    expect(res.body.csrfToken).not.toBe(first.body.csrfToken);
  });

  it('when the password is wrong or the e-mail unknown, then both get the same 401 answer', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const a = await anonymousAgent(ctx.app);
    const wrong = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: u.email, password: 'not it at all' });
    const unknown = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: 'nobody-here@test.example', password: 'whatever123' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    // The same answer, but for the request id each error body carries for the log.
    const { requestId: wrongId, ...wrongError } = wrong.body.error;
    const { requestId: unknownId, ...unknownError } = unknown.body.error;
    expect(wrongError).toEqual(unknownError);
    expect(wrongError).toEqual({ code: 'invalid_credentials', message: GENERIC });
    expect(wrongId).not.toBe(unknownId);
  });

  it('when the account is disabled, then the right password still gets the generic 401', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'consultant', { disabled: true });
    const a = await anonymousAgent(ctx.app);
    const res = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: u.email, password: TEST_PASSWORD });
    expect(res.status).toBe(401);
    expect(res.body.error.message).toBe(GENERIC);
  });

  it('when one address has too many failed attempts at an account, then even the right password from there gets 429 for a while', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const a = await anonymousAgent(ctx.app);
    for (let i = 0; i < 3; i++) {
      await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: u.email, password: `wrong-${i}-guess` }).expect(401);
    }
    const res = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: u.email, password: TEST_PASSWORD });
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('rate_limited');
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('when the body has unknown keys or no e-mail, then 400 with field messages', async () => {
    const a = await anonymousAgent(ctx.app);
    const res = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: 'x@test.example', password: 'p', remember: true });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details._).toEqual([expect.stringMatching(/remember/)]);
    const noEmail = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ password: 'p' });
    expect(noEmail.status).toBe(400);
    expect(noEmail.body.error.details.email).toBeDefined();
  });
});

describe('CSRF', () => {
  it('when the token is missing or wrong, then a state-changing request gets 403', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const a = await anonymousAgent(ctx.app);
    const missing = await a.post('/api/session').send({ email: u.email, password: TEST_PASSWORD });
    expect(missing.status).toBe(403);
    expect(missing.body.error.code).toBe('csrf_invalid');
    const wrong = await a.post('/api/session').set('X-CSRF-Token', 'f'.repeat(64)).send({ email: u.email, password: TEST_PASSWORD });
    expect(wrong.status).toBe(403);
    const signedIn = await signedInAgent(ctx.app, u.email);
    await signedIn.delete('/api/session').expect(403);
  });
});

describe('sign-out', () => {
  it('when signing out, then the session is destroyed on the server and the old cookie no longer works', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'admin');
    const agent = await signedInAgent(ctx.app, u.email);
    const cookieRes = await agent.get('/api/session');
    expect(cookieRes.body.user.id).toBe(u.id);
    const [{ count: before }] = await ctx.deps.ds.query(`SELECT count(*)::int AS count FROM session WHERE (sess::jsonb->'passport')->>'user' = $1`, [u.id]);
    expect(before).toBe(1);
    await agent.delete('/api/session').set('X-CSRF-Token', agent.csrf).expect(204);
    const [{ count: after }] = await ctx.deps.ds.query(`SELECT count(*)::int AS count FROM session WHERE (sess::jsonb->'passport')->>'user' = $1`, [u.id]);
    expect(after).toBe(0);
    const res = await agent.get('/api/session').expect(200);
    expect(res.body.user).toBeNull();
  });
});

describe('audit of sign-in events', () => {
  it('when someone signs in and fails, then both are in the append-only audit log', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const a = await anonymousAgent(ctx.app);
    await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: u.email, password: 'wrong password' }).expect(401);
    await signedInAgent(ctx.app, u.email);
    const events = await ctx.deps.repos.audit.listForEntity('user', u.id);
    expect(events.map((e) => e.action)).toEqual(['session.signed_in', 'session.sign_in_failed']);
    await expect(ctx.deps.ds.query(`UPDATE audit_events SET action = 'x' WHERE entity_id = $1`, [u.id])).rejects.toThrow(/append-only/);
    await expect(ctx.deps.ds.query(`DELETE FROM audit_events WHERE entity_id = $1`, [u.id])).rejects.toThrow(/append-only/);
  });
});

describe('security headers', () => {
  it('when any page is served, then helmet sends a tight CSP', async () => {
    const res = await request(ctx.app).get('/api/session');
    const csp = String(res.headers['content-security-policy']);
    for (const d of ["default-src 'self'", "base-uri 'none'", "frame-ancestors 'none'", "object-src 'none'"]) expect(csp).toContain(d);
  });
});

describe('session timeouts', () => {
  it('when a session is older than the absolute limit, then it is signed out even if active', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const agent = await signedInAgent(ctx.app, u.email);
    const old = Date.now() - 13 * 3600 * 1000;
    await ctx.deps.ds.query(
      `UPDATE session SET sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb($2::bigint))::json WHERE (sess::jsonb->'passport')->>'user' = $1`,
      [u.id, old],
    );
    const res = await agent.get('/api/session').expect(200);
    expect(res.body.user).toBeNull();
  });

  it('when a session is used, then its cookie is renewed for the idle window only', async () => {
    const p = await makeProgramme(ctx.deps);
    const u = await makeUser(ctx.deps, p.id, 'nurse');
    const agent = await signedInAgent(ctx.app, u.email);
    const res = await agent.get('/api/session').expect(200);
    const cookie = String(res.headers['set-cookie']);
    const expires = Date.parse(/Expires=([^;]+)/.exec(cookie)![1]);
    const idleMs = ctx.deps.env.SESSION_IDLE_MINUTES * 60_000;
    expect(expires - Date.now()).toBeLessThanOrEqual(idleMs + 1000);
    expect(expires - Date.now()).toBeGreaterThan(idleMs - 60_000);
  });
});
