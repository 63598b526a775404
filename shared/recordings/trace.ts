import { DEFAULT_ARTEFACT_RULES, isValidSample, type OximetrySample } from '../clinical/oximetry-samples';

/** A chart needs no more points than it has pixels across; 2,000 covers a wide screen. */
export const TRACE_MAX_POINTS = 2000;
/** The chart's reference line: the lowest time-below threshold the summary reports (percentTimeBelow90). */
export const TRACE_THRESHOLD_SPO2 = 90;

export interface TracePoint {
  /** Start of the bucket, seconds from the start of the recording. */
  tSec: number;
  /** Lowest valid SpO2 in the bucket, so a short dip stays visible however far the trace is squeezed. */
  spo2Min: number | null;
  spo2Mean: number | null;
  /** Mean pulse (beats per minute) of the bucket's valid samples that carry one; null when none does. */
  pulseMean: number | null;
}

/**
 * Whole-second buckets wide enough for at most `maxPoints`; artefacts (the analysis's own rules) are left out of
 * both SpO2 and pulse, and a bucket without a valid sample is a null point so the chart shows a gap rather than a
 * false line. A valid sample without a pulse (files with no pulse column) counts for SpO2 only.
 */
export function decimateTrace(ordered: readonly OximetrySample[], maxPoints = TRACE_MAX_POINTS): TracePoint[] {
  if (ordered.length === 0) return [];
  const first = ordered[0].tSec;
  const span = ordered[ordered.length - 1].tSec - first;
  const bucketSec = Math.max(1, Math.ceil((span + 1) / Math.max(1, Math.floor(maxPoints))));
  const buckets = Math.floor(span / bucketSec) + 1;
  const min = new Float64Array(buckets).fill(Infinity);
  const sum = new Float64Array(buckets);
  const count = new Uint32Array(buckets);
  const pulseSum = new Float64Array(buckets);
  const pulseCount = new Uint32Array(buckets);
  for (const sample of ordered) {
    if (!isValidSample(sample, DEFAULT_ARTEFACT_RULES)) continue;
    // At most floor(span / bucketSec) = buckets − 1, since every sample lies within the span.
    const b = Math.floor((sample.tSec - first) / bucketSec);
    const v = sample.spo2 as number;
    if (v < min[b]) min[b] = v;
    sum[b] += v;
    count[b] += 1;
    if (sample.pulse !== null) {
      pulseSum[b] += sample.pulse;
      pulseCount[b] += 1;
    }
  }
  // Stryker disable next-line ArrayDeclaration: preallocation only; the loop below writes every index
  const points: TracePoint[] = new Array(buckets);
  for (let b = 0; b < buckets; b += 1) {
    const some = count[b] > 0;
    points[b] = {
      tSec: first + b * bucketSec,
      spo2Min: some ? min[b] : null,
      spo2Mean: some ? Math.round((sum[b] / count[b]) * 100) / 100 : null,
      pulseMean: pulseCount[b] > 0 ? Math.round((pulseSum[b] / pulseCount[b]) * 10) / 10 : null,
    };
  }
  return points;
}
