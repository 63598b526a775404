import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { readLogPageSchema } from '@shared/schemas/audit';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent, type Agent } from '../helpers/agents';
import { makeClinic } from '../helpers/infants';
import { approvedBaby, post } from '../helpers/approved-baby';
import { csvFromSamples, steadySamples } from '../fixtures/recordings/build-csv';
import { uploadRecording } from '../fixtures/recordings/upload';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

interface ReadRow { action: string; actor_id: string; entity_type: string; entity_id: string; ip: string | null; details: Record<string, unknown>; kind: string }
const readsOf = (infantId: string): Promise<ReadRow[]> =>
  ctx.deps.ds.query(`SELECT action, actor_id, entity_type, entity_id, ip, details, kind FROM audit_events WHERE kind = 'read' AND entity_id = $1 ORDER BY chain_seq`, [infantId]);
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

describe('reads of a baby’s record are audited', () => {
  it('when staff open the record, the setting versions, readings, recordings, a trace, journeys and the care plan, then each read is one row: who, what, which baby, from which address', async () => {
    const { infant, coord, consultant, family, rx, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const recordingId = (await uploadRecording(coord, infant.id, csvFromSamples(steadySamples(90))).expect(202)).body.id as string;
    const journeyId = (await post(family, `/api/infants/${infant.id}/journeys`, { mode: 'road', destinationName: 'High Saddle', destinationElevationM: 2350, departOn: day(5), returnOn: day(6), hoursAway: 30 }).expect(201)).body.journey.id as string;
    const before = (await readsOf(infant.id)).length;

    const paths: Array<[string, string, Record<string, unknown>]> = [
      [`/api/infants/${infant.id}`, 'infant.viewed', {}],
      [`/api/infants/${infant.id}/prescriptions`, 'infant.plans_viewed', {}],
      [`/api/prescriptions/${rx.id}`, 'prescription.viewed', { prescriptionId: rx.id, version: rx.version }],
      [`/api/infants/${infant.id}/readings`, 'infant.readings_viewed', {}],
      [`/api/infants/${infant.id}/recordings`, 'infant.recordings_listed', {}],
      [`/api/recordings/${recordingId}`, 'recording.viewed', { recordingId }],
      [`/api/recordings/${recordingId}/trace`, 'recording.trace_viewed', { recordingId }],
      [`/api/infants/${infant.id}/journeys`, 'infant.journeys_viewed', {}],
      [`/api/journeys/${journeyId}`, 'journey.viewed', { journeyId }],
      [`/api/infants/${infant.id}/care-plan.pdf`, 'infant.care_plan_printed', {}],
    ];
    for (const [path] of paths) await consultant.get(path).expect(200);
    const rows = (await readsOf(infant.id)).slice(before);
    expect(rows.map((r) => r.action)).toEqual(paths.map(([, action]) => action));
    for (const [i, row] of rows.entries()) {
      expect(row).toMatchObject({ kind: 'read', actor_id: clinic.people.consultant.id, entity_type: 'infant', entity_id: infant.id, details: paths[i][2] });
      // Supertest connects over loopback; without trust proxy the socket's address is the one recorded.
      expect(row.ip).toMatch(/127\.0\.0\.1|::1/);
    }
  });

  it('when staff export the record as FHIR, its readings or the caseload or message log as CSV, or print the discharge letter, then each export is one read row', async () => {
    const { infant, coord, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const before = (await readsOf(infant.id)).length;
    await coord.get(`/api/infants/${infant.id}/fhir`).expect(200);
    await coord.get(`/api/infants/${infant.id}/readings.csv`).expect(200);
    await coord.get(`/api/infants/${infant.id}/discharge-letter.pdf`).expect(200);
    const rows = (await readsOf(infant.id)).slice(before);
    expect(rows.map((r) => r.action)).toEqual(['infant.fhir_exported', 'infant.readings_exported', 'infant.discharge_letter_printed']);
    for (const row of rows) expect(row).toMatchObject({ kind: 'read', actor_id: clinic.people.coordinator.id, entity_type: 'infant' });

    await coord.get('/api/infants.csv?status=on_oxygen').expect(200);
    await coord.get('/api/messages.csv').expect(200);
    const lists: Array<{ action: string; entity_type: string }> = await ctx.deps.ds.query(
      `SELECT action, entity_type FROM audit_events WHERE kind = 'read' AND actor_id = $1 AND entity_id IS NULL ORDER BY chain_seq`, [clinic.people.coordinator.id]);
    expect(lists).toEqual([{ action: 'caseload.exported', entity_type: 'caseload' }, { action: 'messages.exported', entity_type: 'messages' }]);
  });

  it('when a family opens its own baby’s plan, then that read is recorded too', async () => {
    const { infant, family, clinic } = await approvedBaby(ctx.deps, ctx.app);
    await family.get(`/api/infants/${infant.id}/prescriptions`).expect(200);
    expect((await readsOf(infant.id)).filter((r) => r.actor_id === clinic.people.family.id).map((r) => r.action)).toEqual(['infant.plans_viewed']);
  });

  it('when a read is refused (another programme, signed out, unknown baby), then no read row is written', async () => {
    const { infant } = await approvedBaby(ctx.deps, ctx.app);
    const stranger = await makeClinic(ctx.deps);
    const before = (await readsOf(infant.id)).length;
    await (await signedInAgent(ctx.app, stranger.people.coordinator.email)).get(`/api/infants/${infant.id}`).expect(404);
    await (await anonymousAgent(ctx.app)).get(`/api/infants/${infant.id}`).expect(401);
    expect((await readsOf(infant.id)).length).toBe(before);
  });

  it('when reads are recorded, then the baby’s change trail still lists changes only', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    await coord.get(`/api/infants/${infant.id}`).expect(200);
    const trail = (await coord.get(`/api/infants/${infant.id}/audit`).expect(200)).body;
    const actions = JSON.stringify(trail);
    expect(actions).toContain('infant.enrolled');
    expect(actions).not.toContain('infant.viewed');
  });
});

describe('behind a proxy', () => {
  it('when the app trusts one proxy, then the address the proxy forwarded is the one recorded', async () => {
    const proxied = await createTestContext({ TRUST_PROXY: 'true' });
    try {
      const { infant, coord, clinic } = await approvedBaby(proxied.deps, proxied.app);
      await coord.get(`/api/infants/${infant.id}`).set('X-Forwarded-For', '203.0.113.7').expect(200);
      const rows: Array<{ ip: string }> = await proxied.deps.ds.query(
        `SELECT ip FROM audit_events WHERE kind = 'read' AND entity_id = $1 AND actor_id = $2`, [infant.id, clinic.people.coordinator.id]);
      expect(rows.map((r) => r.ip)).toEqual(['203.0.113.7']);
    } finally {
      await proxied.close();
    }
  });
});

describe('who looked at this baby’s record (admin)', () => {
  // Rows at fixed instants, so the date filter and the paging never depend on when the suite runs.
  async function seeded() {
    const { infant, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const at = ['2026-03-01T09:00:00Z', '2026-03-02T23:30:00Z', '2026-03-03T08:00:00Z', '2026-03-03T08:00:00Z', '2026-03-04T12:00:00Z'];
    const who = [clinic.people.nurse.id, clinic.people.consultant.id, clinic.people.nurse.id, clinic.people.coordinator.id, clinic.people.nurse.id];
    for (const [i, t] of at.entries()) {
      await ctx.deps.ds.query(
        `INSERT INTO audit_events (programme_id, actor_id, kind, action, entity_type, entity_id, ip, at) VALUES ($1, $2, 'read', 'infant.viewed', 'infant', $3, '198.51.100.1', $4)`,
        [clinic.programme.id, who[i], infant.id, t]);
    }
    const admin = await signedInAgent(ctx.app, clinic.people.admin.email);
    return { infant, clinic, admin };
  }
  const page = async (admin: Agent, path: string) => {
    const body = (await admin.get(path).expect(200)).body;
    expect(readLogPageSchema.safeParse(body).success).toBe(true);
    return body as { items: Array<{ id: string; at: string; words: string; person: { id: string; name: string } | null; ip: string }>; nextCursor: string | null };
  };

  it('when the admin asks, then every read is listed newest first with the person, the words and the address', async () => {
    const { infant, clinic, admin } = await seeded();
    const { items, nextCursor } = await page(admin, `/api/infants/${infant.id}/reads?from=2026-03-01&to=2026-03-04`);
    expect(items.map((i) => i.at)).toEqual(['2026-03-04T12:00:00.000Z', '2026-03-03T08:00:00.000Z', '2026-03-03T08:00:00.000Z', '2026-03-02T23:30:00.000Z', '2026-03-01T09:00:00.000Z']);
    expect(items[0]).toMatchObject({ words: 'Opened the baby\'s record', ip: '198.51.100.1', person: { id: clinic.people.nurse.id, name: clinic.people.nurse.name } });
    expect(nextCursor).toBeNull();
  });

  it('when filtered by person and by day (in the programme’s time zone), then only those reads are listed', async () => {
    const { infant, clinic, admin } = await seeded();
    const byNurse = await page(admin, `/api/infants/${infant.id}/reads?actorId=${clinic.people.nurse.id}&from=2026-03-01&to=2026-03-04`);
    expect(byNurse.items.map((i) => i.at)).toEqual(['2026-03-04T12:00:00.000Z', '2026-03-03T08:00:00.000Z', '2026-03-01T09:00:00.000Z']);
    // The test programme is in Europe/London (GMT in March): 2 March 23:30 UTC is still 2 March.
    const days = await page(admin, `/api/infants/${infant.id}/reads?from=2026-03-02&to=2026-03-03`);
    expect(days.items.map((i) => i.at)).toEqual(['2026-03-03T08:00:00.000Z', '2026-03-03T08:00:00.000Z', '2026-03-02T23:30:00.000Z']);
    // In summer London is on BST: 1 July 23:30 UTC is 00:30 on 2 July there, so it belongs to 2 July, not 1 July.
    await ctx.deps.ds.query(
      `INSERT INTO audit_events (programme_id, actor_id, kind, action, entity_type, entity_id, at) VALUES ($1, $2, 'read', 'infant.viewed', 'infant', $3, '2026-07-01T23:30:00Z')`,
      [clinic.programme.id, clinic.people.nurse.id, infant.id]);
    expect((await page(admin, `/api/infants/${infant.id}/reads?from=2026-07-02&to=2026-07-02`)).items.map((i) => i.at)).toEqual(['2026-07-01T23:30:00.000Z']);
    expect((await page(admin, `/api/infants/${infant.id}/reads?from=2026-07-01&to=2026-07-01`)).items).toEqual([]);
  });

  it('when paged two at a time, then the pages join up with no row twice or missing, equal times included', async () => {
    const { infant, admin } = await seeded();
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const body: Awaited<ReturnType<typeof page>> = await page(admin, `/api/infants/${infant.id}/reads?from=2026-03-01&to=2026-03-04&limit=2${cursor ? `&cursor=${cursor}` : ''}`);
      seen.push(...body.items.map((i) => i.id));
      cursor = body.nextCursor;
      pages += 1;
    } while (cursor);
    expect(pages).toBe(3);
    expect(seen).toHaveLength(5);
    expect(new Set(seen).size).toBe(5);
  });

  it('when someone other than the programme’s admin asks, then 403 (staff of the programme) or 404 (another programme); bad filters 400', async () => {
    const { infant, clinic, admin } = await seeded();
    for (const role of ['coordinator', 'consultant', 'nurse', 'family'] as const) {
      await (await signedInAgent(ctx.app, clinic.people[role].email)).get(`/api/infants/${infant.id}/reads`).expect(403);
    }
    const stranger = await makeClinic(ctx.deps);
    await (await signedInAgent(ctx.app, stranger.people.admin.email)).get(`/api/infants/${infant.id}/reads`).expect(404);
    await admin.get(`/api/infants/${randomUUID()}/reads`).expect(404);
    await (await anonymousAgent(ctx.app)).get(`/api/infants/${infant.id}/reads`).expect(401);
    const details = async (query: string) => Object.keys((await admin.get(`/api/infants/${infant.id}/reads?${query}`).expect(400)).body.error.details);
    expect(await details('actorId=x&from=2026-13-01')).toEqual(['query.actorId', 'query.from']);
    expect(await details('from=2026-03-05&to=2026-03-01')).toEqual(['query.to']);
    expect((await admin.get(`/api/infants/${infant.id}/reads?cursor=zzz`).expect(400)).body.error.details).toHaveProperty('query.cursor');
  });
});
