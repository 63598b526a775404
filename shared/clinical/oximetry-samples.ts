export interface OximetrySample {
  /** Seconds from the start of the recording. */
  tSec: number;
  spo2: number | null;
  pulse: number | null;
  /** Set by the device for low signal quality, low perfusion or sensor off. */
  flagged?: boolean;
}

/**
 * Artefact rules (no single published standard exists; docs/clinical-sources.md §5.1 lists the usual ones):
 * - device-flagged samples are excluded;
 * - SpO2 missing, not a number, or outside 50–100 % is excluded (0 is what many devices write for "no reading"; a
 *   value below 50 % from a home recording is far more often probe loss than a true reading);
 * - a pulse outside 40–250 bpm excludes the sample (motion or a lost signal, when the SpO2 of that moment is not
 *   trusted either); a missing pulse does NOT exclude it, because several export formats carry no pulse column.
 */
export interface ArtefactRules {
  spo2MinPercent: number;
  spo2MaxPercent: number;
  pulseMinBpm: number;
  pulseMaxBpm: number;
}

export const DEFAULT_ARTEFACT_RULES: ArtefactRules = Object.freeze({
  spo2MinPercent: 50,
  spo2MaxPercent: 100,
  pulseMinBpm: 40,
  pulseMaxBpm: 250,
});

export function isValidSample(sample: OximetrySample, rules: ArtefactRules = DEFAULT_ARTEFACT_RULES): boolean {
  if (sample.flagged === true) return false;
  const { spo2, pulse } = sample;
  if (spo2 === null || !Number.isFinite(spo2) || spo2 < rules.spo2MinPercent || spo2 > rules.spo2MaxPercent) {
    return false;
  }
  if (pulse === null) return true;
  return Number.isFinite(pulse) && pulse >= rules.pulseMinBpm && pulse <= rules.pulseMaxBpm;
}

// Total order so that duplicates at the same tSec resolve the same way whatever order they arrive in; the lowest
// valid SpO2 wins a tie because a desaturation metric should not lose the worse of two readings.
function compareSamples(a: OximetrySample, b: OximetrySample, rules: ArtefactRules): number {
  if (a.tSec !== b.tSec) return a.tSec - b.tSec;
  const validA = isValidSample(a, rules) ? 0 : 1;
  const validB = isValidSample(b, rules) ? 0 : 1;
  if (validA !== validB) return validA - validB;
  const spo2Order = (a.spo2 ?? Infinity) - (b.spo2 ?? Infinity);
  if (spo2Order !== 0 && !Number.isNaN(spo2Order)) return spo2Order;
  return (a.pulse ?? Infinity) - (b.pulse ?? Infinity) || 0;
}

/** Sorted by time with one sample per tSec, so results depend on neither input order nor chunking. */
export function orderSamples(samples: readonly OximetrySample[], rules: ArtefactRules): OximetrySample[] {
  for (const sample of samples) {
    if (!Number.isFinite(sample.tSec)) throw new RangeError('Every sample needs a finite tSec');
  }
  // Device exports are nearly always in time order already; skip the sort for them.
  let ascending = true;
  for (let i = 1; i < samples.length && ascending; i += 1) ascending = samples[i].tSec > samples[i - 1].tSec;
  if (ascending) return [...samples];
  const sorted = [...samples].sort((a, b) => compareSamples(a, b, rules));
  return sorted.filter((sample, index) => index === 0 || sample.tSec !== sorted[index - 1].tSec);
}

/**
 * Device rate from the median spacing: robust to the odd gap (a dropped row or a pause) that a mean would absorb.
 * With fewer than two samples there is no spacing, so 1 s (the usual overnight export rate) is assumed.
 */
export function medianSamplePeriodSec(ordered: readonly OximetrySample[]): number {
  if (ordered.length < 2) return 1;
  const gaps = new Float64Array(ordered.length - 1);
  for (let i = 1; i < ordered.length; i += 1) gaps[i - 1] = ordered[i].tSec - ordered[i - 1].tSec;
  gaps.sort();
  const mid = gaps.length >> 1;
  return gaps.length % 2 === 1 ? gaps[mid] : (gaps[mid - 1] + gaps[mid]) / 2;
}
