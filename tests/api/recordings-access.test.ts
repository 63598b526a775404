import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import type { Role } from '@shared/auth/roles';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent, signedInAgent } from '../helpers/agents';
import { makeUser } from '../helpers/factories';
import { makeClinic } from '../helpers/infants';
import { csvFromSamples, steadySamples } from '../fixtures/recordings/build-csv';
import { enrolledBaby, storedFor, uploadRecording, type Clinic } from '../fixtures/recordings/upload';

let ctx: TestContext;
let clinic: Clinic;
let other: Clinic;
let babyId: string;
let recordingId: string;
let otherNurseEmail: string;
beforeAll(async () => {
  ctx = await createTestContext();
  clinic = await makeClinic(ctx.deps);
  other = await makeClinic(ctx.deps);
  babyId = (await enrolledBaby(ctx, clinic, clinic.people.family.email)).id;
  otherNurseEmail = (await makeUser(ctx.deps, clinic.programme.id, 'nurse')).email;
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  recordingId = (await uploadRecording(coord, babyId, csvFromSamples(steadySamples(90))).expect(202)).body.id;
});
afterAll(() => ctx.close());

// A different length each time, so no upload is an idempotent repeat of another.
let uploads = 0;
const csv = () => csvFromSamples(steadySamples(100 + (uploads += 1)));
const as = (email: string) => signedInAgent(ctx.app, email);

describe('who may upload a recording', () => {
  it.each<[Role, number]>([['coordinator', 202], ['nurse', 202], ['consultant', 403], ['admin', 403], ['family', 403]])(
    'when the programme’s %s uploads for the baby, then %i',
    async (role, status) => {
      const before = (await storedFor(ctx, babyId)).recordings;
      await uploadRecording(await as(clinic.people[role].email), babyId, csv()).expect(status);
      expect((await storedFor(ctx, babyId)).recordings).toBe(before + (status === 202 ? 1 : 0));
    },
  );

  it('when another nurse, another programme, or an unknown baby, then 404; signed out 401; a bad id 400', async () => {
    const before = await storedFor(ctx, babyId);
    await uploadRecording(await as(otherNurseEmail), babyId, csv()).expect(404);
    await uploadRecording(await as(other.people.coordinator.email), babyId, csv()).expect(404);
    await uploadRecording(await as(clinic.people.coordinator.email), randomUUID(), csv()).expect(404);
    await uploadRecording(await anonymousAgent(ctx.app), babyId, csv()).expect(401);
    await uploadRecording(await as(clinic.people.coordinator.email), 'not-a-uuid', csv()).expect(400);
    expect(await storedFor(ctx, babyId)).toEqual(before);
  });
});

describe('who may read recordings', () => {
  const paths = () => [`/api/recordings/${recordingId}`, `/api/recordings/${recordingId}/trace`, `/api/infants/${babyId}/recordings`];

  it.each<Role>(['coordinator', 'nurse', 'consultant', 'admin'])('when the programme’s %s reads, then 200 on detail, trace and list', async (role) => {
    const agent = await as(clinic.people[role].email);
    for (const path of paths()) await agent.get(path).expect(200);
    expect((await agent.get(paths()[2])).body.items.map((r: { id: string }) => r.id)).toContain(recordingId);
  });

  it('when the baby’s family reads, then 403 (recordings are staff-only)', async () => {
    const family = await as(clinic.people.family.email);
    await family.get(`/api/infants/${babyId}`).expect(200);
    for (const path of paths()) await family.get(path).expect(403);
  });

  it('when another nurse or another programme reads, then 404; signed out 401', async () => {
    for (const email of [otherNurseEmail, other.people.coordinator.email, other.people.admin.email]) {
      const agent = await as(email);
      for (const path of paths()) await agent.get(path).expect(404);
    }
    const anonymous = await anonymousAgent(ctx.app);
    for (const path of paths()) await anonymous.get(path).expect(401);
  });

  it('when the id is not a uuid, unknown, or the page is out of range, then 400 or 404', async () => {
    const coord = await as(clinic.people.coordinator.email);
    await coord.get('/api/recordings/not-a-uuid').expect(400);
    await coord.get(`/api/recordings/${randomUUID()}`).expect(404);
    await coord.get(`/api/recordings/${randomUUID()}/trace`).expect(404);
    await coord.get(`/api/infants/${babyId}/recordings?pageSize=500`).expect(400);
    await coord.get(`/api/infants/${babyId}/recordings?sort=name`).expect(400);
  });

  it('when a list is paged, then newest first with the total from the database', async () => {
    const coord = await as(clinic.people.coordinator.email);
    const all = (await coord.get(`/api/infants/${babyId}/recordings?pageSize=100`).expect(200)).body;
    expect(all.total).toBe((await storedFor(ctx, babyId)).recordings);
    const uploaded = all.items.map((r: { uploadedAt: string }) => r.uploadedAt);
    expect(uploaded).toEqual([...uploaded].sort().reverse());
    const page2 = (await coord.get(`/api/infants/${babyId}/recordings?pageSize=1&page=2`).expect(200)).body;
    expect(page2).toMatchObject({ total: all.total, items: [{ id: all.items[1].id }] });
  });
});
