import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { makeProgrammeWithStaff, TEST_PASSWORD } from '../helpers/factories';
import { anonymousAgent, signedInAgent, type Agent } from '../helpers/agents';
import { linkToken, mailsTo, mailTo } from '../helpers/account-mail';

// A clock the test moves: set-up links expire after SETUP_LINK_HOURS (72 by default).
let clock = new Date('2026-12-02T09:00:00Z');
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { now: () => clock });
});
afterAll(() => ctx.close());

const post = (a: Agent, path: string, body: object = {}) => a.post(path).set('X-CSRF-Token', a.csrf).send(body);
const uniqueEmail = (who: string) => `${who}-${Math.random().toString(36).slice(2, 10)}@test.example`;

async function invite(email: string, role = 'nurse') {
  const a = await makeProgrammeWithStaff(ctx.deps);
  const admin = await signedInAgent(ctx.app, a.people.admin.email);
  const res = await post(admin, '/api/users', { email, name: 'Fern Oakley', role });
  return { a, admin, res };
}

async function setPassword(token: string, password: string) {
  const visitor = await anonymousAgent(ctx.app);
  return post(visitor, '/api/account/set-password', { token, password });
}

describe('adding a person sends an invitation, never a password', () => {
  it('when an admin adds a person, then 202 with no password, an e-mailed single-use link, only its hash stored, and it is audited', async () => {
    const email = uniqueEmail('fern');
    const { a, res } = await invite(email);
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ status: 'invitation_sent', email });
    expect(JSON.stringify(res.body)).not.toMatch(/password/i);

    const stored = await ctx.deps.repos.users.findByEmail(email);
    expect(stored).toMatchObject({ programmeId: a.programme.id, role: 'nurse', passwordHash: null });
    const message = await mailTo(ctx.mail, email, /Set up your Nestflow account/);
    expect(message.text).toContain('http://nestflow.test/set-password?token=');
    const token = linkToken(message);
    const rows = await ctx.deps.ds.query(`SELECT token_hash, expires_at FROM account_setup_tokens WHERE user_id = $1`, [stored!.id]);
    expect(rows).toHaveLength(1);
    expect(rows[0].token_hash).not.toContain(token);
    expect(rows[0].token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(new Date(rows[0].expires_at).toISOString()).toBe(new Date(clock.getTime() + 72 * 3600_000).toISOString());
    const events = await ctx.deps.repos.audit.listForEntity('user', stored!.id);
    expect(events.find((e) => e.action === 'user.invited')?.actorId).toBe(a.people.admin.id);

    // The People list shows them as not set up yet.
    const list = await (await signedInAgent(ctx.app, a.people.admin.email)).get('/api/users?pageSize=100');
    expect(list.body.items.find((u: { email: string }) => u.email === email)).toMatchObject({ passwordSet: false });
  });

  it('when the invited person has not set a password yet, then signing in fails with the usual answer', async () => {
    const email = uniqueEmail('pending');
    await invite(email);
    const visitor = await anonymousAgent(ctx.app);
    const res = await post(visitor, '/api/session', { email, password: 'anything at all here' });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_credentials');
  });

  it('when the person follows the link, then they are greeted, short and common passwords are refused, and a good one lets them sign in once set', async () => {
    const email = uniqueEmail('joins');
    await invite(email);
    const token = linkToken(await mailTo(ctx.mail, email));
    const visitor = await anonymousAgent(ctx.app);
    const check = await post(visitor, '/api/account/set-password/check', { token }).expect(200);
    expect(check.body).toMatchObject({ email, name: 'Fern Oakley' });

    const short = await setPassword(token, 'too short');
    expect(short.status).toBe(400);
    expect(short.body.error.details.password[0]).toMatch(/at least 12/);
    // "qwerty123456" is in the common-password list of @zxcvbn-ts/language-common.
    const common = await setPassword(token, 'qwerty123456');
    expect(common.status).toBe(400);
    expect(common.body.error.details.password[0]).toMatch(/common passwords/);
    const own = await setPassword(token, email);
    expect(own.status).toBe(400);

    // No composition rules: a long passphrase of lower-case words is fine.
    const ok = await setPassword(token, 'lantern moss under the bridge');
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ email });
    await signedInAgent(ctx.app, email, 'lantern moss under the bridge');

    const again = await setPassword(token, 'another long passphrase');
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('link_invalid');
    const user = await ctx.deps.repos.users.findByEmail(email);
    expect((await ctx.deps.repos.audit.listForEntity('user', user!.id)).map((e) => e.action)).toContain('user.password_set');
  });

  it('when the link is older than its lifetime, or made up, then it is refused with the same answer', async () => {
    const email = uniqueEmail('late');
    await invite(email);
    const token = linkToken(await mailTo(ctx.mail, email));
    const saved = clock;
    clock = new Date(saved.getTime() + 72 * 3600_000 + 1000);
    let late;
    try {
      late = await setPassword(token, 'lantern moss under the bridge');
    } finally {
      clock = saved;
    }
    expect(late.status).toBe(400);
    expect(late.body.error.code).toBe('link_invalid');
    const madeUp = await setPassword('A'.repeat(43), 'lantern moss under the bridge');
    expect(madeUp.status).toBe(400);
    // The same answer, but for the request id each error body carries for the log.
    expect({ ...madeUp.body.error, requestId: undefined }).toEqual({ ...late.body.error, requestId: undefined });
    expect((await ctx.deps.repos.users.findByEmail(email))?.passwordHash).toBeNull();
  });

  it('when the set-password form is sent without its CSRF token, then 403', async () => {
    const res = await request(ctx.app).post('/api/account/set-password').send({ token: 'A'.repeat(43), password: 'lantern moss under the bridge' });
    expect(res.status).toBe(403);
  });
});

describe('no account discovery across programmes', () => {
  it('when an admin adds an e-mail that already has an account in another programme, then the answer is the same as for a new one, nothing is added, and the owner is told', async () => {
    const other = await makeProgrammeWithStaff(ctx.deps);
    const taken = other.people.nurse.email;
    const fresh = uniqueEmail('fresh');
    const { a, admin, res: newOne } = await invite(fresh);
    const existing = await post(admin, '/api/users', { email: taken, name: 'Fern Oakley', role: 'nurse' });

    expect(existing.status).toBe(newOne.status);
    expect({ ...existing.body, email: 'x' }).toEqual({ ...newOne.body, email: 'x' });
    expect(Object.keys(existing.headers).sort()).toEqual(Object.keys(newOne.headers).sort());
    const list = await admin.get('/api/users?pageSize=100');
    expect(list.body.items.map((u: { email: string }) => u.email)).not.toContain(taken);
    expect(list.body.total).toBe(6);

    const notice = await mailTo(ctx.mail, taken, /Someone tried to add/);
    expect(notice.text).not.toMatch(/set-password/);
    expect(notice.text).not.toContain(a.programme.name);
    // The owner's account is untouched.
    await signedInAgent(ctx.app, taken, TEST_PASSWORD);
  });

  it('when an admin adds a person again before they used their link, then a fresh link replaces the first', async () => {
    const email = uniqueEmail('twice');
    const { admin } = await invite(email);
    const first = linkToken(await mailTo(ctx.mail, email));
    await post(admin, '/api/users', { email, name: 'Fern Oakley', role: 'nurse' }).expect(202);
    await new Promise((r) => setTimeout(r, 50));
    const links = mailsTo(ctx.mail, email).map(linkToken);
    expect(links).toHaveLength(2);
    expect(links[1]).not.toBe(first);
    expect((await setPassword(first, 'lantern moss under the bridge')).status).toBe(400);
    expect((await setPassword(links[1], 'lantern moss under the bridge')).status).toBe(200);
  });
});

describe('an admin sends a new set-up link', () => {
  it('when sent, then the person is signed out everywhere, the old password stops working, and the new link sets a new one', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const admin = await signedInAgent(ctx.app, a.people.admin.email);
    const nurse = await signedInAgent(ctx.app, a.people.nurse.email);
    const res = await post(admin, `/api/users/${a.people.nurse.id}/setup-link`);
    expect(res.status).toBe(202);
    expect(res.body.user).toMatchObject({ id: a.people.nurse.id, passwordSet: false });
    expect(JSON.stringify(res.body)).not.toMatch(/token|password"/i);

    expect((await nurse.get('/api/session')).body.user).toBeNull();
    const visitor = await anonymousAgent(ctx.app);
    expect((await post(visitor, '/api/session', { email: a.people.nurse.email, password: TEST_PASSWORD })).status).toBe(401);
    const token = linkToken(await mailTo(ctx.mail, a.people.nurse.email, /new set-up link/));
    expect((await setPassword(token, 'kettle on the windowsill')).status).toBe(200);
    await signedInAgent(ctx.app, a.people.nurse.email, 'kettle on the windowsill');
    expect((await ctx.deps.repos.audit.listForEntity('user', a.people.nurse.id)).map((e) => e.action)).toContain('user.setup_link_sent');
  });

  it('when a non-admin, or an admin of another programme, asks, then 403 / 404 and nothing changes', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const b = await makeProgrammeWithStaff(ctx.deps);
    const coordinator = await signedInAgent(ctx.app, a.people.coordinator.email);
    expect((await post(coordinator, `/api/users/${a.people.nurse.id}/setup-link`)).status).toBe(403);
    const otherAdmin = await signedInAgent(ctx.app, b.people.admin.email);
    expect((await post(otherAdmin, `/api/users/${a.people.nurse.id}/setup-link`)).status).toBe(404);
    await signedInAgent(ctx.app, a.people.nurse.email, TEST_PASSWORD);
  });
});

describe('changing my own password', () => {
  it('when the current password is wrong, or the new one short or common, then 400 on that field; when right, other sessions end and this one stays', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const here = await signedInAgent(ctx.app, a.people.consultant.email);
    const elsewhere = await signedInAgent(ctx.app, a.people.consultant.email);
    const change = (body: object) => here.put('/api/me/password').set('X-CSRF-Token', here.csrf).send(body);

    const wrong = await change({ currentPassword: 'not my password', newPassword: 'lantern moss under the bridge' });
    expect(wrong.status).toBe(400);
    expect(Object.keys(wrong.body.error.details)).toEqual(['currentPassword']);
    const short = await change({ currentPassword: TEST_PASSWORD, newPassword: 'short one' });
    expect(Object.keys(short.body.error.details)).toEqual(['newPassword']);
    const common = await change({ currentPassword: TEST_PASSWORD, newPassword: '1q2w3e4r5t6y' });
    expect(common.body.error.details.newPassword[0]).toMatch(/common passwords/);

    await change({ currentPassword: TEST_PASSWORD, newPassword: 'lantern moss under the bridge' }).expect(204);
    expect((await here.get('/api/session')).body.user?.id).toBe(a.people.consultant.id);
    expect((await elsewhere.get('/api/session')).body.user).toBeNull();
    const visitor = await anonymousAgent(ctx.app);
    expect((await post(visitor, '/api/session', { email: a.people.consultant.email, password: TEST_PASSWORD })).status).toBe(401);
    await signedInAgent(ctx.app, a.people.consultant.email, 'lantern moss under the bridge');
  });
});
