import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Queue, QueueEvents } from 'bullmq';
import { JOBS, conversionJobId } from '@shared/jobs/catalogue';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { startClinicalQueue, type ClinicalQueue } from '../helpers/queues';
import { enrolmentBody, makeClinic } from '../helpers/infants';
import { enrolInfant } from '../../server/modules/infants/enrol';
import { convertPrescriptionProcessor } from '../../worker/processors/convert-prescription.processor';
import { reconcileConversions } from '../../worker/processors/reconcile-conversions.processor';
import { computeProposal } from '../../server/modules/prescriptions/compute-proposal';

let ctx: TestContext;
let clinical: ClinicalQueue;
let events: QueueEvents;
let queue: Queue;
beforeAll(async () => {
  ctx = await createTestContext();
  clinical = await startClinicalQueue(ctx, (job) => convertPrescriptionProcessor(job, ctx.deps.ds, ctx.deps.repos));
  ({ events, queue } = clinical);
});
afterAll(async () => {
  await clinical.close();
  await ctx.close();
});

async function enrol() {
  const clinic = await makeClinic(ctx.deps);
  const actor = { id: clinic.people.coordinator.id, programmeId: clinic.programme.id, ip: null };
  const out = await enrolInfant(ctx.deps.ds, ctx.deps.repos, actor, enrolmentBody(clinic), '2026-12-01');
  return out.prescriptionId!;
}

const statusOf = async (id: string) => (await ctx.deps.ds.query(`SELECT status FROM prescriptions WHERE id = $1`, [id]))[0].status;

describe('convert-prescription job on real Redis', () => {
  it('when a conversion is enqueued, then the worker stores the proposal; enqueuing again makes no second job', async () => {
    const id = await enrol();
    await ctx.deps.jobs.enqueueConversion(id);
    await ctx.deps.jobs.enqueueConversion(id);
    const job = await queue.getJob(conversionJobId(id));
    expect(job?.name).toBe(JOBS.convertPrescription.name);
    await job!.waitUntilFinished(events, 15_000);
    expect(await statusOf(id)).toBe('proposed');
    const counts = await queue.getJobCounts('completed', 'waiting', 'active', 'delayed');
    expect(counts.waiting + counts.active + counts.delayed).toBe(0);
    const all = await queue.getJobs(['completed']);
    expect(all.filter((j) => j.id === conversionJobId(id))).toHaveLength(1);
  });

  it('when the computation runs again for the same proposal, then it is a no-op', async () => {
    const id = await enrol();
    expect(await computeProposal(ctx.deps.ds, ctx.deps.repos, id)).toBe('proposed');
    const first = await ctx.deps.ds.query(`SELECT computed_at FROM prescriptions WHERE id = $1`, [id]);
    expect(await computeProposal(ctx.deps.ds, ctx.deps.repos, id)).toBe('skipped');
    const second = await ctx.deps.ds.query(`SELECT computed_at FROM prescriptions WHERE id = $1`, [id]);
    expect(second).toEqual(first);
  });

  it('when a job was never enqueued (Redis was away), then the reconciler finds the row in PostgreSQL and it gets computed', async () => {
    const id = await enrol();
    expect(await queue.getJob(conversionJobId(id))).toBeUndefined();
    const { requeued } = await reconcileConversions(ctx.deps.repos, ctx.deps.jobs, 0);
    expect(requeued).toBeGreaterThanOrEqual(1);
    const job = await queue.getJob(conversionJobId(id));
    await job!.waitUntilFinished(events, 15_000);
    expect(await statusOf(id)).toBe('proposed');
  });

  it('when the payload is malformed, then the job fails without retrying', async () => {
    const job = await queue.add(JOBS.convertPrescription.name, { prescriptionId: 'nope' }, { attempts: 3 });
    await expect(job.waitUntilFinished(events, 15_000)).rejects.toThrow(/bad payload/);
    const failed = await queue.getJob(job.id!);
    expect(failed?.attemptsMade).toBe(1);
  });
});
