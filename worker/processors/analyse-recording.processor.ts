import { UnrecoverableError, type Job } from 'bullmq';
import type { DataSource } from 'typeorm';
import { JOBS } from '@shared/jobs/catalogue';
import type { AppRepos } from '../../server/deps';
import type { JobProducer } from '../../server/jobs/producer';
import { analyseRecording, reanalyseRecording } from '../../server/modules/recordings/analyse';
import { OXIMETRY_ANALYSIS_VERSION } from '@shared/clinical/oximetry';
import { afterStudy } from '../../server/modules/step-downs/after-study';

/** Payload carries only the id; samples are reloaded from PostgreSQL, so retries and duplicates are harmless. */
export async function analyseRecordingProcessor(job: Job, ds: DataSource, repos: AppRepos, jobs?: JobProducer) {
  const parsed = JOBS.analyseRecording.payload.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError('analyse-recording: bad payload');
  const outcome = await analyseRecording(ds, repos, parsed.data.recordingId);
  if (outcome !== 'done') return { outcome };
  const after = await afterStudy(ds, repos, parsed.data.recordingId);
  // A completed study changes what is due next.
  if (after && jobs) await jobs.enqueuePlanInfant(after.infantId);
  return { outcome, proposed: after?.proposal?.reason ?? null };
}

/**
 * PostgreSQL is the source of truth: a recording still 'queued' (Redis was away at upload, or the job was lost)
 * or still 'analysing' long after an analysis takes (the worker died, or every retry failed) is enqueued again
 * under its fixed job id, which BullMQ ignores while that job still exists.
 */
export async function reconcileRecordings(repos: AppRepos, jobs: JobProducer, queuedSeconds = 30, analysingSeconds = 600) {
  const ids = await repos.recordings.stale(queuedSeconds, analysingSeconds);
  for (const id of ids) await jobs.enqueueAnalysis(id);
  return { requeued: ids.length };
}

/**
 * After the analysis rules change (a new OXIMETRY_ANALYSIS_VERSION), every stored study is analysed again so the
 * newest summary is shown; each old summary stays in recording_analyses with its version. A batch per run.
 */
export async function reanalyseOutdated(ds: DataSource, repos: AppRepos, batch = 200) {
  const rows = await repos.recordings.outdatedAnalysisIds(OXIMETRY_ANALYSIS_VERSION, batch);

  let done = 0;
  const failed: string[] = [];
  for (const { id } of rows) {
    // One unreadable study must not stop the others; it keeps the summary it had, and the job reports it.
    try {
      if ((await reanalyseRecording(ds, repos, id)) === 'done') done += 1;
    } catch {
      failed.push(id);
    }
  }
  return { reanalysed: done, failed };
}
