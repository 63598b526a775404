import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localToInstant } from '@shared/schedule/local-time';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent, type Agent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { insertReminder } from '../helpers/reminders';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const post = (a: Agent, path: string, body: unknown = {}) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);

/** A programme with a baby whose family (Europe/London, SMS agreed) has a visit booked in three days. */
async function programmeWithVisit() {
  const clinic = await makeClinic(ctx.deps);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const infant = (await post(coord, '/api/infants', enrolmentBody(clinic, { familyEmail: clinic.people.family.email })).expect(201)).body;
  const visit = (await post(coord, `/api/infants/${infant.id}/visits`, {
    kind: 'home_visit', date: future(3), time: '10:00', durationMinutes: 45, staffId: clinic.people.nurse.id, purpose: 'Spot check and weight',
  }).expect(201)).body;
  return { clinic, coord, infant, visit };
}

describe('message log: who may see it', () => {
  it('when nobody is signed in, then listing and sending again answer 401', async () => {
    const anon = await anonymousAgent(ctx.app);
    expect((await anon.get('/api/messages').expect(401)).body.error.code).toBe('unauthenticated');
    await post(anon, `/api/messages/${randomUUID()}/retry`).expect(401);
  });

  it.each(['nurse', 'consultant', 'family'] as const)('when a %s asks, then listing and sending again answer 403', async (role) => {
    const { clinic } = await programmeWithVisit();
    const failedId = await insertReminder(ctx.deps, { programmeId: clinic.programme.id });
    const a = await signedInAgent(ctx.app, clinic.people[role].email);
    expect((await a.get('/api/messages').expect(403)).body.error.code).toBe('forbidden');
    await post(a, `/api/messages/${failedId}/retry`).expect(403);
    const [row] = await ctx.deps.ds.query(`SELECT status FROM reminders WHERE id = $1`, [failedId]);
    expect(row.status).toBe('failed');
  });

  it('when the query is bad, then 400 names each field', async () => {
    const { coord } = await programmeWithVisit();
    const res = await coord.get('/api/messages?status=lost&pageSize=500&channel=fax&template=party&sort=when&infantId=x').expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details).toEqual({
      'query.status': ['Unknown status'], 'query.pageSize': ['At most 100 rows a page'], 'query.channel': ['Unknown channel'],
      'query.template': ['Unknown message type'], 'query.sort': ['Unknown sort'], 'query.infantId': ['Must be a valid id'],
    });
    const extra = await coord.get('/api/messages?colour=red').expect(400);
    expect(Object.keys(extra.body.error.details)).toEqual(['query']);
    const badId = await post(coord, '/api/messages/not-an-id/retry').expect(400);
    expect(badId.body.error.details).toEqual({ 'params.id': ['Must be a valid id'] });
  });
});

describe('message log: what it lists', () => {
  it("when a visit is booked, then the coordinator and the admin see the family's booking note and two reminders, and another programme sees none of them", async () => {
    const { clinic, coord, infant, visit } = await programmeWithVisit();
    const res = await coord.get('/api/messages?sort=sendAt').expect(200);
    expect(res.body.total).toBe(3);
    // The booking note first (now, or when quiet hours end), then 17:00 the day before and 08:00 on the day, London
    // time (policy defaults; timing is checked in tests/shared/reminders).
    expect(res.body.items).toEqual([
      expect.objectContaining({ template: 'visit-booked', channel: 'sms', status: 'scheduled' }),
      expect.objectContaining({
        template: 'visit-day-before', channel: 'sms', status: 'scheduled', reason: null, attempts: 0, sentAt: null,
        recipient: { kind: 'family', name: 'Parent One', address: '+447700900001' }, infant: { id: infant.id, name: `Test ${infant.familyName}` },
        sendAt: localToInstant(future(2), '17:00', 'Europe/London')!.toISOString(),
      }),
      expect.objectContaining({ template: 'visit-morning', status: 'scheduled', sendAt: localToInstant(visit.date, '08:00', 'Europe/London')!.toISOString() }),
    ]);
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    expect((await admin.get('/api/messages').expect(200)).body.items.map((m: { template: string }) => m.template).sort()).toEqual(['visit-booked', 'visit-day-before', 'visit-morning']);

    const other = await programmeWithVisit();
    const outsider = (await other.coord.get('/api/messages?pageSize=100').expect(200)).body;
    expect(outsider.total).toBe(3);
    expect(outsider.items.every((m: { infant: { id: string } }) => m.infant.id === other.infant.id)).toBe(true);
    expect((await other.coord.get(`/api/messages?infantId=${infant.id}`).expect(200)).body).toEqual({ items: [], total: 0, totalIsEstimate: false, nextCursor: null, prevCursor: null });
  });

  it('when the log is filtered by status and paged, then only matching rows come back with the full total', async () => {
    const { clinic, coord, infant } = await programmeWithVisit();
    const failedId = await insertReminder(ctx.deps, { programmeId: clinic.programme.id, infantId: infant.id, lastError: 'Unknown number' });
    const failed = (await coord.get('/api/messages?status=failed').expect(200)).body;
    expect(failed.total).toBe(1);
    expect(failed.items[0]).toMatchObject({ id: failedId, status: 'failed', lastError: 'Unknown number', attempts: 1 });
    const page2 = (await coord.get('/api/messages?pageSize=2&page=2&sort=sendAt').expect(200)).body;
    expect(page2.total).toBe(4);
    expect(page2.items).toHaveLength(2);
    expect((await coord.get('/api/messages?page=9').expect(200)).body).toEqual({ items: [], total: 4, totalIsEstimate: false, nextCursor: null, prevCursor: null });
  });
});

describe('sending a failed message again', () => {
  it("when the message belongs to another programme or does not exist, then 404 and it stays as it was", async () => {
    const mine = await programmeWithVisit();
    const theirs = await programmeWithVisit();
    const theirFailed = await insertReminder(ctx.deps, { programmeId: theirs.clinic.programme.id, infantId: theirs.infant.id });
    expect((await post(mine.coord, `/api/messages/${theirFailed}/retry`).expect(404)).body.error.code).toBe('not_found');
    await post(mine.coord, `/api/messages/${randomUUID()}/retry`).expect(404);
    const [row] = await ctx.deps.ds.query(`SELECT status FROM reminders WHERE id = $1`, [theirFailed]);
    expect(row.status).toBe('failed');
  });

  it('when the message has not failed, then 409', async () => {
    const { coord } = await programmeWithVisit();
    const [scheduled] = (await coord.get('/api/messages').expect(200)).body.items;
    const res = await post(coord, `/api/messages/${scheduled.id}/retry`).expect(409);
    expect(res.body.error.message).toContain('scheduled');
    const [row] = await ctx.deps.ds.query(`SELECT status, send_at FROM reminders WHERE id = $1`, [scheduled.id]);
    expect(row.status).toBe('scheduled');
    expect(new Date(row.send_at).toISOString()).toBe(scheduled.sendAt);
  });

  it('when the coordinator sends a failed message again, then it is scheduled now and the retry is audited', async () => {
    const { clinic, coord, infant } = await programmeWithVisit();
    const failedId = await insertReminder(ctx.deps, { programmeId: clinic.programme.id, infantId: infant.id });
    const before = Date.now();
    const res = await post(coord, `/api/messages/${failedId}/retry`).expect(200);
    expect(res.body.message).toMatchObject({ id: failedId, status: 'scheduled', reason: null, infant: { id: infant.id, name: `Test ${infant.familyName}` } });
    const [row] = await ctx.deps.ds.query(`SELECT status, send_at FROM reminders WHERE id = $1`, [failedId]);
    expect(row.status).toBe('scheduled');
    expect(new Date(row.send_at).getTime()).toBeGreaterThanOrEqual(before - 1000);
    expect(new Date(row.send_at).getTime()).toBeLessThanOrEqual(Date.now() + 1000);
    const audit = await ctx.deps.ds.query(`SELECT actor_id, details FROM audit_events WHERE action = 'message.retried' AND entity_id = $1`, [infant.id]);
    expect(audit).toEqual([{ actor_id: clinic.people.coordinator.id, details: { messageId: failedId, template: 'visit-day-before' } }]);
    // A second press finds it scheduled already.
    await post(coord, `/api/messages/${failedId}/retry`).expect(409);
  });

  it('when an e-mail of unknown outcome is marked as arrived, then it is recorded as sent, audited and can be neither resent nor marked twice', async () => {
    const { clinic, coord, infant } = await programmeWithVisit();
    const id = await insertReminder(ctx.deps, { programmeId: clinic.programme.id, infantId: infant.id, status: 'unknown' });
    const theirs = await programmeWithVisit();
    await post(theirs.coord, `/api/messages/${id}/arrived`).expect(404);
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    await post(nurse, `/api/messages/${id}/arrived`).expect(403);
    const res = await post(coord, `/api/messages/${id}/arrived`).expect(200);
    expect(res.body.message).toMatchObject({ id, status: 'sent' });
    const audit = await ctx.deps.ds.query(`SELECT actor_id, details FROM audit_events WHERE action = 'message.confirmed-arrived' AND entity_id = $1`, [infant.id]);
    expect(audit).toEqual([{ actor_id: clinic.people.coordinator.id, details: { messageId: id, template: 'visit-day-before' } }]);
    await post(coord, `/api/messages/${id}/arrived`).expect(409);
    await post(coord, `/api/messages/${id}/retry`).expect(409);
  });

  it('when the admin sends a failed staff message again, then 200', async () => {
    const { clinic } = await programmeWithVisit();
    const failedId = await insertReminder(ctx.deps, { programmeId: clinic.programme.id, template: 'nurse-digest' });
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    expect((await post(admin, `/api/messages/${failedId}/retry`).expect(200)).body.message).toMatchObject({ id: failedId, status: 'scheduled', infant: null });
  });
});

describe('message log: search', () => {
  it("when the coordinator searches by baby, recipient or number, then only matching rows come back, within the caller's programme", async () => {
    const a = await programmeWithVisit();
    const b = await programmeWithVisit();
    // Another programme's baby has the same made-up family name: the search never reaches across programmes.
    await ctx.deps.ds.query(`UPDATE infants SET family_name = $2 WHERE id = $1`, [b.infant.id, a.infant.familyName]);
    const ids = async (q: string) => (await a.coord.get(`/api/messages?q=${encodeURIComponent(q)}&pageSize=100`).expect(200)).body;

    const byBaby = await ids(a.infant.familyName.toLowerCase());
    expect(byBaby.total).toBe(3);
    expect(byBaby.items.every((m: { infant: { id: string } }) => m.infant.id === a.infant.id)).toBe(true);
    expect((await ids('Parent One')).total).toBe(3);
    // The number as a family would say it (national form) finds the E.164 address.
    expect((await ids('07700 900001')).total).toBe(3);
    expect((await ids('nobody-by-that-name')).total).toBe(0);
    // LIKE's wildcards are plain text here: '%' alone matches nothing.
    expect((await ids('%')).total).toBe(0);
  });

  it('when the search text is too long or holds control characters, then 400 names the field', async () => {
    const { coord } = await programmeWithVisit();
    const long = await coord.get(`/api/messages?q=${'a'.repeat(101)}`).expect(400);
    expect(long.body.error.details).toEqual({ 'query.q': ['At most 100 characters'] });
    const control = await coord.get('/api/messages?q=ab%07cd').expect(400);
    expect(Object.keys(control.body.error.details)).toEqual(['query.q']);
  });
});
