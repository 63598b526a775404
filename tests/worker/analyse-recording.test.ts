import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Queue, QueueEvents } from 'bullmq';
import { JOBS, recordingJobId } from '@shared/jobs/catalogue';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { startClinicalQueue, type ClinicalQueue } from '../helpers/queues';
import { signedInAgent } from '../helpers/agents';
import { makeClinic } from '../helpers/infants';
import { analyseRecordingProcessor, reconcileRecordings } from '../../worker/processors/analyse-recording.processor';
import { analyseRecording } from '../../server/modules/recordings/analyse';
import { storeUpload } from '../../server/modules/recordings/upload';
import { defineAbilityFor } from '@shared/auth/ability';
import { csvFromSamples, steadySamples } from '../fixtures/recordings/build-csv';
import { enrolledBaby, uploadRecording } from '../fixtures/recordings/upload';

let ctx: TestContext;
let clinical: ClinicalQueue;
let events: QueueEvents;
let queue: Queue;
beforeAll(async () => {
  ctx = await createTestContext();
  // Enrolment also enqueues conversions on this queue; this worker only takes recordings and leaves the rest done.
  clinical = await startClinicalQueue(ctx, async (job) => (job.name === JOBS.analyseRecording.name ? analyseRecordingProcessor(job, ctx.deps.ds, ctx.deps.repos) : null));
  ({ events, queue } = clinical);
});
afterAll(async () => {
  await clinical.close();
  await ctx.close();
});

let nights = 0;
async function uploaded() {
  const clinic = await makeClinic(ctx.deps);
  const baby = await enrolledBaby(ctx, clinic);
  const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
  const res = await uploadRecording(coord, baby.id, csvFromSamples(steadySamples(120 + (nights += 1)))).expect(202);
  return res.body.id as string;
}
/** Stored as an upload commits it, but never enqueued: Redis was away at that moment. */
async function storedWithoutJob() {
  const clinic = await makeClinic(ctx.deps);
  const baby = await enrolledBaby(ctx, clinic);
  const { id: userId } = clinic.people.coordinator;
  const ability = defineAbilityFor({ id: userId, role: 'coordinator', programmeId: clinic.programme.id });
  const file = { buffer: Buffer.from(csvFromSamples(steadySamples(120 + (nights += 1)))), originalname: 'night.csv' };
  const out = await storeUpload(ctx.deps.ds, ctx.deps.repos, ability, { id: userId, programmeId: clinic.programme.id, ip: null }, baby.id, file, { timeFormat: 'auto' });
  return out.id;
}
const row = async (id: string) =>
  (await ctx.deps.ds.query(`SELECT status, analysed_at, valid_minutes, failure_reason FROM recordings WHERE id = $1`, [id]))[0];

describe('analyse-recording job on real Redis', () => {
  it('when an upload is enqueued, then the worker analyses it; enqueuing again makes no second job; a re-run is a no-op', async () => {
    const id = await uploaded();
    await ctx.deps.jobs.enqueueAnalysis(id);
    const job = await queue.getJob(recordingJobId(id));
    expect(job?.name).toBe(JOBS.analyseRecording.name);
    expect(await job!.waitUntilFinished(events, 15_000)).toEqual({ outcome: 'done', proposed: null });
    const done = await row(id);
    expect(done).toMatchObject({ status: 'done', valid_minutes: (120 + nights) / 60, failure_reason: null });
    const all = await queue.getJobs(['completed', 'waiting', 'active', 'delayed']);
    expect(all.filter((j) => j.id === recordingJobId(id))).toHaveLength(1);

    expect(await analyseRecording(ctx.deps.ds, ctx.deps.repos, id)).toBe('skipped');
    expect(await row(id)).toEqual(done);
    const analysed = await ctx.deps.ds.query(`SELECT count(*)::int n FROM audit_events WHERE action = 'recording.analysed' AND details->>'recordingId' = $1`, [id]);
    expect(analysed).toEqual([{ n: 1 }]);
  });

  it('when a job was never enqueued (Redis was away) or a worker died mid-analysis, then the reconciler finds the row and it gets analysed', async () => {
    const queued = await storedWithoutJob();
    const stuck = await storedWithoutJob();
    await ctx.deps.ds.query(`UPDATE recordings SET status = 'analysing', status_at = now() - interval '1 hour' WHERE id = $1`, [stuck]);
    for (const id of [queued, stuck]) expect(await queue.getJob(recordingJobId(id))).toBeUndefined();
    const { requeued } = await reconcileRecordings(ctx.deps.repos, ctx.deps.jobs, 0, 600);
    expect(requeued).toBeGreaterThanOrEqual(2);
    for (const id of [queued, stuck]) {
      await (await queue.getJob(recordingJobId(id)))!.waitUntilFinished(events, 15_000);
      expect((await row(id)).status).toBe('done');
    }
  });

  it('when a recording is still being analysed recently, then the reconciler leaves it to its worker', async () => {
    const id = await uploaded();
    await (await queue.getJob(recordingJobId(id)))?.waitUntilFinished(events, 15_000);
    await ctx.deps.ds.query(`UPDATE recordings SET status = 'analysing', status_at = now() WHERE id = $1`, [id]);
    expect(await ctx.deps.repos.recordings.stale(0, 600)).not.toContain(id);
    expect(await ctx.deps.repos.recordings.stale(0, 0)).toContain(id);
  });

  it('when the stored samples cannot be read, then the recording fails with a readable reason and is not retried', async () => {
    const id = await uploaded();
    await (await queue.getJob(recordingJobId(id)))?.waitUntilFinished(events, 15_000);
    await ctx.deps.ds.query(`UPDATE recordings SET status = 'queued' WHERE id = $1`, [id]);
    await ctx.deps.ds.query(`UPDATE recording_samples SET layout = 9 WHERE recording_id = $1`, [id]);
    expect(await analyseRecording(ctx.deps.ds, ctx.deps.repos, id)).toBe('failed');
    expect(await row(id)).toMatchObject({ status: 'failed', failure_reason: 'The recording could not be analysed: the samples are stored in layout 9, which this version cannot read.' });
    expect(await analyseRecording(ctx.deps.ds, ctx.deps.repos, id)).toBe('skipped');
  });

  it('when the payload is malformed, then the job fails without retrying', async () => {
    const job = await queue.add(JOBS.analyseRecording.name, { recordingId: 'nope' }, { attempts: 3 });
    await expect(job.waitUntilFinished(events, 15_000)).rejects.toThrow(/bad payload/);
    expect((await queue.getJob(job.id!))?.attemptsMade).toBe(1);
  });
});
