import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Role } from '@shared/auth/roles';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { makeProgrammeWithStaff, makeUser } from '../helpers/factories';
import { signedInAgent } from '../helpers/agents';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const PROTECTED: Array<[string, string]> = [
  ['get', '/api/users'],
  ['post', '/api/users'],
  ['post', '/api/users/00000000-0000-4000-8000-000000000000/disable'],
  ['post', '/api/users/00000000-0000-4000-8000-000000000000/enable'],
  ['post', '/api/users/00000000-0000-4000-8000-000000000000/setup-link'],
  ['put', '/api/me/password'],
];

describe('protected routes without a session', () => {
  it.each(PROTECTED)('when %s %s is called signed out, then 401', async (method, path) => {
    const agent = request.agent(ctx.app);
    const { body } = await agent.get('/api/session');
    const res = await (agent as unknown as Record<string, (p: string) => request.Test>)[method](path).set('X-CSRF-Token', body.csrfToken).send({});
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('role × action matrix for people management', () => {
  const expectations: Record<Role, { list: number; create: number; disable: number }> = {
    admin: { list: 200, create: 202, disable: 200 },
    coordinator: { list: 200, create: 403, disable: 403 },
    nurse: { list: 200, create: 403, disable: 403 },
    consultant: { list: 200, create: 403, disable: 403 },
    family: { list: 403, create: 403, disable: 403 },
  };
  it.each(Object.entries(expectations))('when a %s acts, then list/create/disable answer as allowed', async (role, want) => {
    const { programme, people } = await makeProgrammeWithStaff(ctx.deps);
    const target = await makeUser(ctx.deps, programme.id, 'nurse');
    const agent = await signedInAgent(ctx.app, people[role as Role].email);
    expect((await agent.get('/api/users')).status).toBe(want.list);
    const created = await agent.post('/api/users').set('X-CSRF-Token', agent.csrf).send({ email: `new-${role}-${Date.now()}@test.example`, name: 'New Person', role: 'nurse' });
    expect(created.status).toBe(want.create);
    const disabled = await agent.post(`/api/users/${target.id}/disable`).set('X-CSRF-Token', agent.csrf);
    expect(disabled.status).toBe(want.disable);
    const stored = await ctx.deps.repos.users.findByEmail(target.email);
    expect(stored?.disabled).toBe(want.disable === 200);
  });
});

describe('GET /api/users', () => {
  it('when an admin lists people, then only their own programme is returned, paged and sorted', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const b = await makeProgrammeWithStaff(ctx.deps);
    const agent = await signedInAgent(ctx.app, a.people.admin.email);
    const res = await agent.get('/api/users?pageSize=2&sort=-role').expect(200);
    expect(res.body.total).toBe(5);
    expect(res.body.items).toHaveLength(2);
    expect(res.body.items.map((u: { role: string }) => u.role)).toEqual(['nurse', 'family']);
    const all = await agent.get('/api/users?pageSize=100').expect(200);
    expect(all.body.items.every((u: { programmeId: string }) => u.programmeId === a.programme.id)).toBe(true);
    expect(all.body.items.find((u: { id: string }) => u.id === b.people.admin.id)).toBeUndefined();
    expect(all.body.items[0]).not.toHaveProperty('passwordHash');
  });

  it('when filtering by role and text, then the filter runs in SQL', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const agent = await signedInAgent(ctx.app, a.people.admin.email);
    const res = await agent.get(`/api/users?role=consultant&q=${encodeURIComponent(a.people.consultant.name.slice(0, 10))}`).expect(200);
    expect(res.body.items.map((u: { id: string }) => u.id)).toEqual([a.people.consultant.id]);
  });

  it('when the query is malformed, then 400 with field messages', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const agent = await signedInAgent(ctx.app, a.people.admin.email);
    const res = await agent.get('/api/users?page=0&sort=password&role=pilot').expect(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['query.page', 'query.role', 'query.sort']);
  });
});

describe('POST /api/users', () => {
  it('when fields are bad, then 400 with a message per field', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const agent = await signedInAgent(ctx.app, a.people.admin.email);
    const res = await agent.post('/api/users').set('X-CSRF-Token', agent.csrf).send({ email: 'not-an-email', name: 'X', role: 'pilot', programmeId: a.programme.id }).expect(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['_', 'email', 'name', 'role']);
  });
});

describe('disabling people', () => {
  it('when an admin disables a person, then their open sessions end at once', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const nurse = await signedInAgent(ctx.app, a.people.nurse.email);
    expect((await nurse.get('/api/users')).status).toBe(200);
    const admin = await signedInAgent(ctx.app, a.people.admin.email);
    const res = await admin.post(`/api/users/${a.people.nurse.id}/disable`).set('X-CSRF-Token', admin.csrf).expect(200);
    expect(res.body.user.disabled).toBe(true);
    expect((await nurse.get('/api/users')).status).toBe(401);
    expect((await nurse.get('/api/session')).body.user).toBeNull();
    await admin.post(`/api/users/${a.people.nurse.id}/enable`).set('X-CSRF-Token', admin.csrf).expect(200);
    await signedInAgent(ctx.app, a.people.nurse.email);
  });

  it('when an admin tries to disable themself, then 409', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const admin = await signedInAgent(ctx.app, a.people.admin.email);
    await admin.post(`/api/users/${a.people.admin.id}/disable`).set('X-CSRF-Token', admin.csrf).expect(409);
  });

  it('when the id is not a uuid, then 400', async () => {
    const a = await makeProgrammeWithStaff(ctx.deps);
    const admin = await signedInAgent(ctx.app, a.people.admin.email);
    const res = await admin.post('/api/users/12/disable').set('X-CSRF-Token', admin.csrf).expect(400);
    expect(res.body.error.details['params.id']).toBeDefined();
  });
});

describe('programme isolation', () => {
  it('when a Saltmarsh-style admin targets another programme, then they can neither list nor change those people', async () => {
    const larkmoor = await makeProgrammeWithStaff(ctx.deps);
    const saltmarsh = await makeProgrammeWithStaff(ctx.deps);
    const admin = await signedInAgent(ctx.app, saltmarsh.people.admin.email);
    const list = await admin.get('/api/users?pageSize=100').expect(200);
    expect(list.body.items.some((u: { programmeId: string }) => u.programmeId === larkmoor.programme.id)).toBe(false);
    await admin.post(`/api/users/${larkmoor.people.nurse.id}/disable`).set('X-CSRF-Token', admin.csrf).expect(404);
    await admin.post(`/api/users/${larkmoor.people.nurse.id}/enable`).set('X-CSRF-Token', admin.csrf).expect(404);
    const stored = await ctx.deps.repos.users.findByEmail(larkmoor.people.nurse.email);
    expect(stored?.disabled).toBe(false);
  });
});
