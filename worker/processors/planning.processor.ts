import { UnrecoverableError, type Job } from 'bullmq';
import { JOBS } from '@shared/jobs/catalogue';
import type { AppRepos } from '../../server/deps';
import { replan } from '../../server/modules/schedule/planning';

/** Plans checks for one baby or a whole programme; the stored plan is an upsert by key, so repeats are harmless. */
export async function planningProcessor(job: Job, repos: AppRepos) {
  if (job.name === JOBS.planInfant.name) {
    const p = JOBS.planInfant.payload.safeParse(job.data);
    if (!p.success) throw new UnrecoverableError('plan-infant: bad payload');
    return replan(repos, { infantIds: [p.data.infantId] });
  }
  if (job.name === JOBS.replanProgramme.name) {
    const p = JOBS.replanProgramme.payload.safeParse(job.data);
    if (!p.success) throw new UnrecoverableError('replan-programme: bad payload');
    return replan(repos, { programmeId: p.data.programmeId });
  }
  throw new UnrecoverableError(`Unknown planning job ${job.name}`);
}
