import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { Queue } from 'bullmq';
import { summariseOximetry, OXIMETRY_ANALYSIS_VERSION, type OximetrySummary } from '@shared/clinical/oximetry';
import { JOBS, QUEUES, recordingJobId } from '@shared/jobs/catalogue';
import { decodeSamples } from '@shared/recordings/sample-codec';
import { recordingSchema, recordingTraceSchema } from '@shared/schemas/recordings';
import { analyseRecording } from '../../server/modules/recordings/analyse';
import { redisConnection } from '../../worker/queues';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { makeClinic } from '../helpers/infants';
import { buildNoisyTrace } from '../shared/clinical/helpers/synthetic-oximetry';
import { csvFromSamples, NIGHT_START_MS, steadySamples } from '../fixtures/recordings/build-csv';
import { enrolledBaby, storedFor, uploadRecording } from '../fixtures/recordings/upload';

let ctx: TestContext;
let queue: Queue;
beforeAll(async () => {
  ctx = await createTestContext();
  queue = new Queue(QUEUES.clinical, { connection: redisConnection(ctx.deps.env.REDIS_URL), prefix: ctx.deps.env.QUEUE_PREFIX });
});
afterAll(async () => {
  await queue.close();
  await ctx.close();
});

const expectedSummary = (s: OximetrySummary) => ({
  validMinutes: s.validMinutes, meanSpo2: s.meanSpo2, medianSpo2: s.medianSpo2, minSpo2: s.minSpo2, pctBelow90: s.percentTimeBelow90,
  pctBelow92: s.percentTimeBelow92, pctBelow93: s.percentTimeBelow93, odi3: s.odi3PerHour, odi4: s.odi4PerHour, meanPulse: s.meanPulse,
  judged: s.judged, minValidMinutes: s.minValidMinutes, minEventSeconds: s.minEventSeconds,
});

describe('POST /api/infants/:id/recordings, then the analysis', () => {
  it('when the baby’s nurse uploads a night, then 202, the samples are stored compactly, analysed, and shown as summariseOximetry gives them', async () => {
    const clinic = await makeClinic(ctx.deps);
    const baby = await enrolledBaby(ctx, clinic);
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    const samples = buildNoisyTrace(3600, 7);
    const csv = csvFromSamples(samples);
    const res = await uploadRecording(nurse, baby.id, csv, {}, 'C:\\exports\\../night.csv').expect(202);
    expect(Object.keys(res.body)).toEqual(['id']);
    const id = res.body.id;

    expect((await queue.getJob(recordingJobId(id)))?.name).toBe(JOBS.analyseRecording.name);
    const queued = recordingSchema.parse((await nurse.get(`/api/recordings/${id}`).expect(200)).body);
    expect(queued).toMatchObject({
      status: 'queued', infantId: baby.id, fileName: 'night.csv', sha256: createHash('sha256').update(csv).digest('hex'), sampleCount: 3600,
      startedAt: new Date(NIGHT_START_MS).toISOString(), durationMinutes: 60, uploadedBy: { id: clinic.people.nurse.id, name: clinic.people.nurse.name },
      analysisVersion: null, timeFormat: 'iso', skippedRows: 0,
    });
    expect(queued.summary).toBeUndefined();
    expect(await storedFor(ctx, baby.id)).toEqual({ recordings: 1, samples: 1, audits: 1 });
    const stored = await ctx.deps.repos.recordings.loadSamples(id);
    expect(decodeSamples(stored!)).toEqual(samples);

    expect(await analyseRecording(ctx.deps.ds, ctx.deps.repos, id)).toBe('done');
    const done = recordingSchema.parse((await nurse.get(`/api/recordings/${id}`).expect(200)).body);
    const expected = summariseOximetry(samples);
    expect(done).toMatchObject({ status: 'done', analysisVersion: OXIMETRY_ANALYSIS_VERSION });
    expect(done.summary).toEqual(expectedSummary(expected));
    expect(expected.odi3Events.length).toBeGreaterThan(0);

    const trace = recordingTraceSchema.parse((await nurse.get(`/api/recordings/${id}/trace`).expect(200)).body);
    expect(trace.threshold).toBe(90);
    expect(trace.points).toHaveLength(1800);
    expect(Math.min(...trace.points.map((p) => p.spo2Min ?? 101))).toBe(expected.minSpo2);
    // The pulse trace comes with it: the answer itself carries a mean pulse per 2 s bucket (schema defaults would hide its absence).
    const rawPoints = (await nurse.get(`/api/recordings/${id}/trace`).expect(200)).body.points as Array<{ pulseMean: number | null }>;
    expect(rawPoints.every((p) => 'pulseMean' in p)).toBe(true);
    const pulses = samples.slice(0, 2).map((s) => s.pulse).filter((v): v is number => v !== null);
    expect(rawPoints[0].pulseMean).toBe(Math.round((pulses.reduce((a, b) => a + b, 0) / pulses.length) * 10) / 10);
    expect(trace.events).toEqual(expected.odi3Events.map((e) => ({ startSec: e.startTSec, endSec: e.endTSec, nadir: e.nadirSpo2, deep: e.deep })));

    const list = await nurse.get(`/api/infants/${baby.id}/recordings`).expect(200);
    expect(list.body).toMatchObject({ total: 1, items: [{ id, status: 'done', summary: expectedSummary(expected) }] });
    const audit = await ctx.deps.repos.audit.listForEntity('infant', baby.id);
    expect(audit.find((a) => a.action === 'recording.uploaded')).toMatchObject({ actorId: clinic.people.nurse.id, details: { recordingId: id, sha256: queued.sha256 } });
    expect(audit.find((a) => a.action === 'recording.analysed')).toMatchObject({ actorId: null, details: { recordingId: id, analysisVersion: OXIMETRY_ANALYSIS_VERSION } });
  });

  it('when a recording has artefacts (flagged rows, SpO2 0 and above 100), then valid time leaves them out', async () => {
    const clinic = await makeClinic(ctx.deps);
    const baby = await enrolledBaby(ctx, clinic);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const artefacts: Array<[number, { spo2?: number; flagged?: boolean }]> = [];
    for (let t = 100; t < 160; t += 1) artefacts.push([t, { flagged: true, spo2: 70 }]);
    for (let t = 300; t < 330; t += 1) artefacts.push([t, { spo2: 0 }]);
    for (let t = 500; t < 530; t += 1) artefacts.push([t, { spo2: 127 }]);
    const samples = steadySamples(1200, artefacts);
    const { body } = await uploadRecording(coord, baby.id, csvFromSamples(samples)).expect(202);
    await analyseRecording(ctx.deps.ds, ctx.deps.repos, body.id);
    const { summary } = (await coord.get(`/api/recordings/${body.id}`).expect(200)).body;
    expect(summary).toMatchObject({ validMinutes: (1200 - 120) / 60, minSpo2: 96, meanSpo2: 96, pctBelow90: 0 });
    expect(summary).toEqual(expectedSummary(summariseOximetry(samples)));
  });

  it('when the same file is sent again (or twice at once), then the same id comes back and one recording exists', async () => {
    const clinic = await makeClinic(ctx.deps);
    const baby = await enrolledBaby(ctx, clinic);
    const other = await enrolledBaby(ctx, clinic);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const csv = csvFromSamples(steadySamples(120));
    const first = await uploadRecording(coord, baby.id, csv).expect(202);
    const again = await uploadRecording(coord, baby.id, csv, { timeFormat: 'iso' }, 'renamed.csv').expect(200);
    expect(again.body).toEqual(first.body);
    expect(await storedFor(ctx, baby.id)).toEqual({ recordings: 1, samples: 1, audits: 1 });

    const racing = csvFromSamples(steadySamples(121));
    const [a, b] = await Promise.all([uploadRecording(coord, baby.id, racing), uploadRecording(coord, baby.id, racing)]);
    expect([a.status, b.status].sort()).toEqual([200, 202]);
    expect(a.body.id).toBe(b.body.id);
    expect((await storedFor(ctx, baby.id)).recordings).toBe(2);
    // The same file for another baby is that baby's own recording.
    expect((await uploadRecording(coord, other.id, csv).expect(202)).body.id).not.toBe(first.body.id);
  });

  it('when the columns are not ours, then 400 lists the headers; with a column mapping the same file is accepted', async () => {
    const clinic = await makeClinic(ctx.deps);
    const baby = await enrolledBaby(ctx, clinic);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const headers = { timestamp: 'Time (s)', spo2: 'SpO2 %', pulse: 'Pulse rate', status: 'Quality' };
    const csv = csvFromSamples(steadySamples(90), { time: 'seconds', headers });
    const refused = await uploadRecording(coord, baby.id, csv).expect(400);
    expect(refused.body.error).toMatchObject({ code: 'wrong_columns', details: { found: ['Time (s)', 'SpO2 %', 'Pulse rate', 'Quality'] } });
    expect(refused.body.error.message).toMatch(/Columns found: "Time \(s\)"/);
    expect(await storedFor(ctx, baby.id)).toEqual({ recordings: 0, samples: 0, audits: 0 });

    const mapping = { timestampColumn: 'Time (s)', spo2Column: 'SpO2 %', pulseColumn: 'Pulse rate', statusColumn: 'Quality', timeFormat: 'seconds' };
    const { body } = await uploadRecording(coord, baby.id, csv, mapping).expect(202);
    expect((await coord.get(`/api/recordings/${body.id}`).expect(200)).body).toMatchObject({ timeFormat: 'seconds', startedAt: null, sampleCount: 90 });
    const bad = await uploadRecording(coord, baby.id, csv, { spo2Column: 'SpO2 %', pulseColumn: 'spo2 %', colour: 'red' }).expect(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['_', 'pulseColumn']);
  });
});
