import { DEFAULT_MIN_VALID_MINUTES } from '@shared/clinical/oximetry';
import { DEFAULT_MIN_EVENT_SECONDS } from '@shared/clinical/oximetry-events';
import type { DesaturationEvent } from '@shared/clinical/oximetry-events';
import type { Recording, RecordingTrace } from '@shared/schemas/recordings';
import { TRACE_THRESHOLD_SPO2, type TracePoint } from '@shared/recordings/trace';
import type { RecordingWithUploader } from '../../db/repositories/recordings.repository';

export function toRecordingDto(r: RecordingWithUploader): Recording {
  const dto: Recording = {
    id: r.id, infantId: r.infantId, status: r.status, fileName: r.fileName, sha256: r.sha256, byteSize: r.byteSize,
    uploadedAt: r.uploadedAt.toISOString(), uploadedBy: { id: r.uploadedBy, name: r.uploaderName ?? '' },
    timeFormat: r.timeFormat, startedAt: r.startedAt ? r.startedAt.toISOString() : null,
    durationMinutes: r.durationSec / 60, sampleCount: r.sampleCount, samplePeriodSec: r.samplePeriodSec, skippedRows: r.skippedRows,
    analysisVersion: r.analysisVersion, analysedAt: r.analysedAt ? r.analysedAt.toISOString() : null,
  };
  if (r.status === 'failed') dto.failureReason = r.failureReason ?? 'The analysis did not complete.';
  if (r.status === 'done') {
    dto.summary = {
      validMinutes: r.validMinutes ?? 0, meanSpo2: r.meanSpo2, medianSpo2: r.medianSpo2, minSpo2: r.minSpo2,
      pctBelow90: r.pctBelow90, pctBelow92: r.pctBelow92, pctBelow93: r.pctBelow93, odi3: r.odi3, odi4: r.odi4, meanPulse: r.meanPulse,
      // Every done recording has these since the StudyJudgement migration; the defaults only type the nullable columns.
      judged: r.judged ?? false, minValidMinutes: r.minValidMinutes ?? DEFAULT_MIN_VALID_MINUTES, minEventSeconds: r.minEventSeconds ?? DEFAULT_MIN_EVENT_SECONDS,
    };
  }
  return dto;
}

export function toTraceDto(points: TracePoint[], events: DesaturationEvent[] | null): RecordingTrace {
  return {
    points,
    events: (events ?? []).map((e) => ({ startSec: e.startTSec, endSec: e.endTSec, nadir: e.nadirSpo2, deep: e.deep })),
    threshold: TRACE_THRESHOLD_SPO2,
  };
}
