import {
  DEFAULT_DESATURATION_RULES,
  detectDesaturations,
  type DesaturationEvent,
  type DesaturationRules,
} from './oximetry-events';
import {
  DEFAULT_ARTEFACT_RULES,
  isValidSample,
  medianSamplePeriodSec,
  orderSamples,
  type ArtefactRules,
  type OximetrySample,
} from './oximetry-samples';

// Stored with every summary; bump when a rule or default below changes, so old and new summaries are not mixed.
// 2.0.0: events end at holes, artefact runs and held partial recoveries; a new fall starts with nothing carried
// over from the previous one (1.x needed one sample more after a counted event); minimum event time from policy.
export const OXIMETRY_ANALYSIS_VERSION = 'nestflow-oximetry-2.0.0';

/** Below this much valid time a study is too short to judge (Urschitz 2003 excluded recordings under 5 h, §5.1). */
export const DEFAULT_MIN_VALID_MINUTES = 300;

export interface OximetryOptions {
  /** Overrides the period derived from the median spacing of tSec. */
  samplePeriodSec?: number;
  artefactRules?: ArtefactRules;
  desaturationRules?: DesaturationRules;
  /** The programme's minimum event duration; overrides desaturationRules.minDurationSec. */
  minEventSeconds?: number;
  /** The programme's minimum valid time for a study to be judged at all. */
  minValidMinutes?: number;
}

export interface OximetrySummary {
  version: string;
  samplePeriodSec: number;
  sampleCount: number;
  validSampleCount: number;
  /** Artefact-free time: valid samples × sample period. */
  validMinutes: number;
  /** False when validMinutes is below the minimum: the study is too short to judge and counts for nothing. */
  judged: boolean;
  minValidMinutes: number;
  minEventSeconds: number;
  meanSpo2: number | null;
  medianSpo2: number | null;
  minSpo2: number | null;
  /**
   * Share of valid time with SpO2 strictly below 90, 92 and 93 %. Strict "<" follows the guideline wording
   * ("% time less than 90%", docs/clinical-sources.md §5.1); a reading of exactly 90 is not counted.
   */
  percentTimeBelow90: number | null;
  percentTimeBelow92: number | null;
  percentTimeBelow93: number | null;
  /**
   * Falls of ≥ 3 / ≥ 4 points below baseline per hour of valid time (rules in oximetry-events.ts). ODI4 events are
   * a subset of ODI3 events, so ODI4 ≤ ODI3 always.
   */
  odi3PerHour: number | null;
  odi4PerHour: number | null;
  meanPulse: number | null;
  /** The ODI3 events, for marking on a chart; those with `deep` set are the ODI4 events. */
  odi3Events: DesaturationEvent[];
}

interface ValidSeries {
  tSec: Float64Array;
  spo2: Float64Array;
  pulseSum: number;
  pulseCount: number;
}

function collectValid(ordered: readonly OximetrySample[], rules: ArtefactRules): ValidSeries {
  const tSec = new Float64Array(ordered.length);
  const spo2 = new Float64Array(ordered.length);
  let count = 0;
  let pulseSum = 0;
  let pulseCount = 0;
  for (const sample of ordered) {
    if (!isValidSample(sample, rules)) continue;
    tSec[count] = sample.tSec;
    spo2[count] = sample.spo2 as number;
    count += 1;
    if (sample.pulse !== null) {
      pulseSum += sample.pulse;
      pulseCount += 1;
    }
  }
  return { tSec: tSec.subarray(0, count), spo2: spo2.subarray(0, count), pulseSum, pulseCount };
}

function spo2Statistics(spo2: Float64Array) {
  const n = spo2.length;
  const below = [0, 0, 0];
  let sum = 0;
  for (const value of spo2) {
    sum += value;
    if (value < 90) below[0] += 1;
    if (value < 92) below[1] += 1;
    if (value < 93) below[2] += 1;
  }
  const sorted = Float64Array.from(spo2).sort();
  const mid = n >> 1;
  return {
    meanSpo2: sum / n,
    medianSpo2: n % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2,
    minSpo2: sorted[0],
    percentTimeBelow90: (100 * below[0]) / n,
    percentTimeBelow92: (100 * below[1]) / n,
    percentTimeBelow93: (100 * below[2]) / n,
  };
}

const EMPTY_STATISTICS = {
  meanSpo2: null,
  medianSpo2: null,
  minSpo2: null,
  percentTimeBelow90: null,
  percentTimeBelow92: null,
  percentTimeBelow93: null,
};

/** Summary of one recording; samples may come in any order and at any regular rate. */
export function summariseOximetry(samples: readonly OximetrySample[], options: OximetryOptions = {}): OximetrySummary {
  const artefactRules = options.artefactRules ?? DEFAULT_ARTEFACT_RULES;
  const baseRules = options.desaturationRules ?? DEFAULT_DESATURATION_RULES;
  const desaturationRules = options.minEventSeconds === undefined ? baseRules : { ...baseRules, minDurationSec: options.minEventSeconds };
  const minValidMinutes = options.minValidMinutes ?? DEFAULT_MIN_VALID_MINUTES;
  const ordered = orderSamples(samples, artefactRules);
  const samplePeriodSec = options.samplePeriodSec ?? medianSamplePeriodSec(ordered);
  if (!(samplePeriodSec > 0)) throw new RangeError('Sample period must be positive');
  const valid = collectValid(ordered, artefactRules);
  const n = valid.spo2.length;
  const validHours = (n * samplePeriodSec) / 3600;
  const events = detectDesaturations(valid.tSec, valid.spo2, samplePeriodSec, desaturationRules);
  const deepCount = events.filter((event) => event.deep).length;
  return {
    version: OXIMETRY_ANALYSIS_VERSION,
    samplePeriodSec,
    sampleCount: ordered.length,
    validSampleCount: n,
    validMinutes: (n * samplePeriodSec) / 60,
    judged: (n * samplePeriodSec) / 60 >= minValidMinutes,
    minValidMinutes,
    minEventSeconds: desaturationRules.minDurationSec,
    ...(n === 0 ? EMPTY_STATISTICS : spo2Statistics(valid.spo2)),
    odi3PerHour: n === 0 ? null : events.length / validHours,
    odi4PerHour: n === 0 ? null : deepCount / validHours,
    meanPulse: valid.pulseCount === 0 ? null : valid.pulseSum / valid.pulseCount,
    odi3Events: events,
  };
}

/** Chunks (e.g. one per stored hour) are analysed as one recording, so splitting never changes a result. */
export function summariseOximetryChunks(
  chunks: readonly (readonly OximetrySample[])[],
  options: OximetryOptions = {},
): OximetrySummary {
  return summariseOximetry(chunks.flat(), options);
}
