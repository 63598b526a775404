import type { DataSource } from 'typeorm';
import { OXIMETRY_ANALYSIS_VERSION, summariseOximetry, type OximetrySummary } from '@shared/clinical/oximetry';
import { decodeSamples, SAMPLE_LAYOUT_VERSION } from '@shared/recordings/sample-codec';
import type { AppRepos } from '../../deps';

export type AnalyseOutcome = 'done' | 'skipped' | 'missing' | 'failed';

/**
 * The worker's step for one recording: 'queued' → 'analysing' → 'done' (or 'failed' with a reason).
 * Idempotent: a done or failed recording is left alone, and a duplicate run finds the row no longer 'analysing'.
 * A database error is thrown so the job retries; a problem with the stored data itself fails the recording,
 * because retrying would only fail the same way.
 */
export async function analyseRecording(ds: DataSource, repos: AppRepos, recordingId: string): Promise<AnalyseOutcome> {
  const claimed = await ds.transaction(async (m) => {
    const r = await repos.recordings.findForUpdate(recordingId, m);
    if (!r) return 'missing' as const;
    if (r.status === 'done' || r.status === 'failed') return 'skipped' as const;
    if (r.status === 'queued') {
      r.status = 'analysing';
      r.statusAt = new Date();
      await repos.recordings.save(r, m);
    }
    return { programmeId: r.programmeId };
  });
  if (typeof claimed === 'string') return claimed;

  let summary: OximetrySummary;
  try {
    summary = await summarise(repos, recordingId, claimed.programmeId);
  } catch (err) {
    await failRecording(ds, repos, recordingId, `The recording could not be analysed: ${(err as Error).message}.`);
    return 'failed';
  }
  return storeSummary(ds, repos, recordingId, summary, 'analysing');
}

/** The programme's analysis settings (minimum event time, minimum valid time) apply to every study it analyses. */
async function summarise(repos: AppRepos, recordingId: string, programmeId: string): Promise<OximetrySummary> {
  const stored = await repos.recordings.loadSamples(recordingId);
  if (!stored) throw new Error('the stored samples are missing');
  if (stored.layout !== SAMPLE_LAYOUT_VERSION) throw new Error(`the samples are stored in layout ${stored.layout}, which this version cannot read`);
  const { oximetry } = (await repos.policies.current(programmeId)).settings;
  return summariseOximetry(decodeSamples(stored), { minEventSeconds: oximetry.minEventSeconds, minValidMinutes: oximetry.minValidMinutes });
}

/**
 * Analyses again a recording analysed by an older version of the rules. The summary shown becomes the new one;
 * the old one stays in recording_analyses with its version. Checks and proposals are not re-run: they were
 * decided on the evidence of their time, which the audit trail keeps.
 */
export async function reanalyseRecording(ds: DataSource, repos: AppRepos, recordingId: string): Promise<AnalyseOutcome> {
  const row = await repos.recordings.analysisState(recordingId);
  if (!row) return 'missing';
  if (row.status !== 'done' || row.analysis_version === OXIMETRY_ANALYSIS_VERSION) return 'skipped';
  return storeSummary(ds, repos, recordingId, await summarise(repos, recordingId, row.programme_id), 'done');
}

async function storeSummary(ds: DataSource, repos: AppRepos, recordingId: string, s: OximetrySummary, from: 'analysing' | 'done'): Promise<AnalyseOutcome> {
  return ds.transaction(async (m) => {
    const r = await repos.recordings.findForUpdate(recordingId, m);
    if (!r || r.status !== from) return 'skipped';
    const previousVersion = r.analysisVersion;
    const now = new Date();
    Object.assign(r, {
      status: 'done', analysisVersion: s.version, validMinutes: s.validMinutes, meanSpo2: s.meanSpo2, medianSpo2: s.medianSpo2,
      minSpo2: s.minSpo2, pctBelow90: s.percentTimeBelow90, pctBelow92: s.percentTimeBelow92, pctBelow93: s.percentTimeBelow93,
      odi3: s.odi3PerHour, odi4: s.odi4PerHour, meanPulse: s.meanPulse, events: s.odi3Events, samplePeriodSec: s.samplePeriodSec,
      judged: s.judged, minEventSeconds: s.minEventSeconds, minValidMinutes: s.minValidMinutes,
      failureReason: null, analysedAt: now, statusAt: now,
    });
    await repos.recordings.save(r, m);
    await repos.recordings.insertAnalysis({
      recordingId: r.id, version: s.version, summary: {
        validMinutes: s.validMinutes, meanSpo2: s.meanSpo2, medianSpo2: s.medianSpo2, minSpo2: s.minSpo2, pctBelow90: s.percentTimeBelow90,
        pctBelow92: s.percentTimeBelow92, pctBelow93: s.percentTimeBelow93, odi3: s.odi3PerHour, odi4: s.odi4PerHour, meanPulse: s.meanPulse,
        judged: s.judged, minEventSeconds: s.minEventSeconds, minValidMinutes: s.minValidMinutes,
      }, events: s.odi3Events, analysedAt: now,
    }, m);
    await repos.audit.append(
      {
        programmeId: r.programmeId, actorId: null, action: from === 'done' ? 'recording.reanalysed' : 'recording.analysed', entityType: 'infant', entityId: r.infantId,
        details: { recordingId: r.id, analysisVersion: s.version, previousVersion, sampleCount: s.sampleCount, validSampleCount: s.validSampleCount, judged: s.judged },
      },
      m,
    );
    return 'done';
  });
}

/** Ends a recording the analysis cannot handle; the reason is shown to staff. */
export async function failRecording(ds: DataSource, repos: AppRepos, recordingId: string, reason: string) {
  await ds.transaction(async (m) => {
    const r = await repos.recordings.findForUpdate(recordingId, m);
    if (!r || r.status === 'done' || r.status === 'failed') return;
    Object.assign(r, { status: 'failed', failureReason: reason, statusAt: new Date() });
    await repos.recordings.save(r, m);
    await repos.audit.append(
      { programmeId: r.programmeId, actorId: null, action: 'recording.failed', entityType: 'infant', entityId: r.infantId, details: { recordingId: r.id, reason } },
      m,
    );
  });
}
