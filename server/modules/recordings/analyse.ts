import type { DataSource } from 'typeorm';
import { summariseOximetry, type OximetrySummary } from '../../../shared/clinical/oximetry';
import { decodeSamples, SAMPLE_LAYOUT_VERSION } from '../../../shared/recordings/sample-codec';
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
    return 'claimed' as const;
  });
  if (claimed !== 'claimed') return claimed;

  const stored = await repos.recordings.loadSamples(recordingId);
  let summary: OximetrySummary;
  try {
    if (!stored) throw new Error('the stored samples are missing');
    if (stored.layout !== SAMPLE_LAYOUT_VERSION) throw new Error(`the samples are stored in layout ${stored.layout}, which this version cannot read`);
    summary = summariseOximetry(decodeSamples(stored));
  } catch (err) {
    await failRecording(ds, repos, recordingId, `The recording could not be analysed: ${(err as Error).message}.`);
    return 'failed';
  }
  return storeSummary(ds, repos, recordingId, summary);
}

async function storeSummary(ds: DataSource, repos: AppRepos, recordingId: string, s: OximetrySummary): Promise<AnalyseOutcome> {
  return ds.transaction(async (m) => {
    const r = await repos.recordings.findForUpdate(recordingId, m);
    if (!r || r.status !== 'analysing') return 'skipped';
    const now = new Date();
    Object.assign(r, {
      status: 'done', analysisVersion: s.version, validMinutes: s.validMinutes, meanSpo2: s.meanSpo2, medianSpo2: s.medianSpo2,
      minSpo2: s.minSpo2, pctBelow90: s.percentTimeBelow90, pctBelow92: s.percentTimeBelow92, pctBelow93: s.percentTimeBelow93,
      odi3: s.odi3PerHour, odi4: s.odi4PerHour, meanPulse: s.meanPulse, events: s.odi3Events, samplePeriodSec: s.samplePeriodSec,
      failureReason: null, analysedAt: now, statusAt: now,
    });
    await repos.recordings.save(r, m);
    await repos.audit.append(
      {
        programmeId: r.programmeId, actorId: null, action: 'recording.analysed', entityType: 'infant', entityId: r.infantId,
        details: { recordingId: r.id, analysisVersion: s.version, sampleCount: s.sampleCount, validSampleCount: s.validSampleCount },
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
