import { UnrecoverableError, type Job } from 'bullmq';
import type { DataSource } from 'typeorm';
import { JOBS } from '@shared/jobs/catalogue';
import type { AppRepos } from '../../server/deps';
import { computeProposal } from '../../server/modules/prescriptions/compute-proposal';

/** Payload carries only the id; the state is reloaded from PostgreSQL, so retries and duplicates are harmless. */
export async function convertPrescriptionProcessor(job: Job, ds: DataSource, repos: AppRepos) {
  const parsed = JOBS.convertPrescription.payload.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError('convert-prescription: bad payload');
  return { outcome: await computeProposal(ds, repos, parsed.data.prescriptionId) };
}
