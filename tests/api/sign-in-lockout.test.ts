import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { makeProgramme, makeUser, TEST_PASSWORD } from '../helpers/factories';
import { anonymousAgent, type Agent } from '../helpers/agents';
import { mailsTo, mailTo } from '../helpers/account-mail';

let ctx: TestContext;
beforeAll(async () => {
  // Addresses come from X-Forwarded-For (as behind the production proxy), so one test can be several callers.
  ctx = await createTestContext({ TRUST_PROXY: 'true', SIGNIN_PAIR_LIMIT: '5', SIGNIN_ACCOUNT_LIMIT: '12', SIGNIN_IP_LIMIT: '1000' });
});
afterAll(() => ctx.close());

const from = (a: Agent, ip: string, email: string, password: string) =>
  a.post('/api/session').set('X-CSRF-Token', a.csrf).set('X-Forwarded-For', ip).send({ email, password });

async function account() {
  const p = await makeProgramme(ctx.deps);
  return makeUser(ctx.deps, p.id, 'nurse');
}

describe('sign-in failures are counted per account and address', () => {
  it('when a stranger gets the password wrong five times, then the stranger is refused but the owner on their own address still signs in', async () => {
    const u = await account();
    const stranger = await anonymousAgent(ctx.app);
    for (let i = 0; i < 5; i++) expect((await from(stranger, '198.51.100.7', u.email, `guess number ${i}`)).status).toBe(401);
    const blocked = await from(stranger, '198.51.100.7', u.email, TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);

    const owner = await anonymousAgent(ctx.app);
    expect((await from(owner, '203.0.113.20', u.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('when attempts are refused, then each one is audited with the limit that refused it', async () => {
    const u = await account();
    const stranger = await anonymousAgent(ctx.app);
    for (let i = 0; i < 5; i++) await from(stranger, '198.51.100.8', u.email, `guess number ${i}`);
    for (let i = 0; i < 3; i++) expect((await from(stranger, '198.51.100.8', u.email, `guess again ${i}`)).status).toBe(429);
    const events = (await ctx.deps.repos.audit.listForEntity('user', u.id)).filter((e) => e.action === 'session.sign_in_blocked');
    expect(events).toHaveLength(3);
    expect(events[0]).toMatchObject({ details: { limit: 'pair' }, ip: '198.51.100.8' });
  });

  it('when an account is being tried, then its owner gets one e-mail for the period, not one per attempt', async () => {
    const u = await account();
    const stranger = await anonymousAgent(ctx.app);
    for (let i = 0; i < 4; i++) await from(stranger, '198.51.100.9', u.email, `guess number ${i}`);
    expect(mailsTo(ctx.mail, u.email)).toHaveLength(0);
    for (let i = 0; i < 6; i++) await from(stranger, '198.51.100.9', u.email, `more guesses ${i}`);
    const alert = await mailTo(ctx.mail, u.email, /trying to sign in/);
    expect(alert.text).toMatch(/5 failed attempts/);
    await new Promise((r) => setTimeout(r, 200));
    expect(mailsTo(ctx.mail, u.email)).toHaveLength(1);
    expect((await ctx.deps.repos.audit.listForEntity('user', u.id)).filter((e) => e.action === 'session.owner_alerted')).toHaveLength(1);
  });

  it('when guesses come from many addresses, then the slower per-account limit stops them too', async () => {
    const u = await account();
    const stranger = await anonymousAgent(ctx.app);
    // Four addresses × three guesses = 12 failures, each address below its own limit of 5.
    for (const ip of ['192.0.2.1', '192.0.2.2', '192.0.2.3', '192.0.2.4']) {
      for (let i = 0; i < 3; i++) expect((await from(stranger, ip, u.email, `guess ${ip} ${i}`)).status).toBe(401);
    }
    expect((await from(stranger, '192.0.2.5', u.email, 'one more guess')).status).toBe(429);
    const events = (await ctx.deps.repos.audit.listForEntity('user', u.id)).filter((e) => e.action === 'session.sign_in_blocked');
    expect(events.at(-1)?.details).toMatchObject({ limit: 'account' });
  });

  it('when the owner signs in successfully, then their own address starts again from zero', async () => {
    const u = await account();
    const owner = await anonymousAgent(ctx.app);
    for (let i = 0; i < 4; i++) await from(owner, '203.0.113.30', u.email, `typo number ${i}`);
    expect((await from(owner, '203.0.113.30', u.email, TEST_PASSWORD)).status).toBe(200);
    const again = await anonymousAgent(ctx.app);
    for (let i = 0; i < 4; i++) expect((await from(again, '203.0.113.30', u.email, `typo again ${i}`)).status).toBe(401);
  });
});

describe('sign-in while Redis is down', () => {
  it('when the limits cannot be checked, then 503, not 500, and nothing is stored', async () => {
    // A port nothing listens on stands in for a Redis that has gone away.
    const down = await createTestContext({ REDIS_URL: 'redis://127.0.0.1:1' });
    try {
      const p = await makeProgramme(down.deps);
      const u = await makeUser(down.deps, p.id, 'nurse');
      const a = await anonymousAgent(down.app);
      const before = Number((await down.deps.ds.query(`SELECT count(*)::int AS n FROM session`))[0].n);
      const res = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: u.email, password: TEST_PASSWORD });
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('unavailable');
      expect(Number((await down.deps.ds.query(`SELECT count(*)::int AS n FROM session`))[0].n)).toBe(before);
    } finally {
      await down.close();
    }
  });
});
