/**
 * Desaturation events (ODI3 / ODI4). No single published algorithm exists (docs/clinical-sources.md §5.1: baseline,
 * minimum duration and the handling of consecutive dips are not standardised), so every parameter is pinned here
 * and in the tests:
 * - baseline: mean of the valid samples in the 120 s before the fall begins, trusted only when they cover half of
 *   that window; held fixed for the whole event;
 * - a fall begins at a sample ≥ dropPoints below the baseline and counts once it has stayed there for
 *   minDurationSec (10 s is the common adult scoring convention, from memory; a programme policy setting);
 * - it ends at recovery: back within recoveryWithinPoints of the baseline, or a rise of ≥ dropPoints above the
 *   lowest point so far that holds for recoveryHoldSec — two falls with such a recovery between them are two
 *   events, and the second must itself fall ≥ dropPoints below the level it recovered to;
 * - it also ends at a hole: valid samples more than maxGapSec apart (missing rows, or a run of artefact, which
 *   arrives here as missing valid samples). An event never spans a hole; a fall not yet long enough is dropped.
 */
export interface DesaturationRules {
  baselineWindowSec: number;
  baselineMinCoverage: number;
  /** Points below baseline that make a fall (ODI3). */
  dropPoints: number;
  /** Points below the same baseline, held for the minimum duration, that make the event count for ODI4 too. */
  deepDropPoints: number;
  minDurationSec: number;
  recoveryWithinPoints: number;
  /** How long a partial recovery (≥ dropPoints above the lowest point) must hold to end the event. */
  recoveryHoldSec: number;
  /** Missing time between two valid samples longer than this ends any event. */
  maxGapSec: number;
}

export const DEFAULT_MIN_EVENT_SECONDS = 10;

export const DEFAULT_DESATURATION_RULES: DesaturationRules = Object.freeze({
  baselineWindowSec: 120,
  baselineMinCoverage: 0.5,
  dropPoints: 3,
  deepDropPoints: 4,
  minDurationSec: DEFAULT_MIN_EVENT_SECONDS,
  recoveryWithinPoints: 1,
  // Our choice (no published standard, §5.1): a recovery must outlast a couple of samples of noise.
  recoveryHoldSec: 5,
  maxGapSec: 5,
});

export interface DesaturationEvent {
  startTSec: number;
  /** Start of the recovery, or the end of the last sample's period before a hole or the end of the recording. */
  endTSec: number;
  nadirSpo2: number;
  baselineSpo2: number;
  /** True when the event also held ≥ deepDropPoints below its baseline for the minimum duration (ODI4). */
  deep: boolean;
}

// SpO2 values are often integers, but averages are not; this keeps 94 ≤ 97 − 3 true when the mean is 96.99999999.
const EPS = 1e-9;

/** The fall being followed. Every field is set in begin(), so nothing carries over from the previous fall. */
class FallTracker {
  open = false;
  /** After a partial recovery, a new fall must go this low (the recovered level − dropPoints); else no limit. */
  reFallLimit = Infinity;
  private confirmed = false;
  private startTSec = 0;
  private baseline = 0;
  private nadir = 0;
  private belowSec = 0;
  private deepRunSec = 0;
  private deep = false;
  private riseStartTSec = 0;
  private riseSec = 0;
  private riseLow = 0;

  constructor(
    private readonly rules: DesaturationRules,
    private readonly periodSec: number,
    private readonly events: DesaturationEvent[],
  ) {}

  begin(tSec: number, value: number, baseline: number): void {
    this.open = true;
    this.confirmed = false;
    this.startTSec = tSec;
    this.baseline = baseline;
    this.nadir = value;
    this.belowSec = 0;
    this.deepRunSec = 0;
    this.deep = false;
    this.riseSec = 0;
    this.reFallLimit = Infinity;
    this.countBelow(value);
  }

  /** Follows the open fall by one sample; afterwards `open` says whether it is still going. */
  step(tSec: number, value: number): void {
    const { rules } = this;
    if (!this.confirmed) {
      // Not yet long enough: any sample above the fall threshold ends it uncounted.
      if (value > this.baseline - rules.dropPoints + EPS) this.open = false;
      else this.countBelow(value);
      return;
    }
    if (value >= this.baseline - rules.recoveryWithinPoints - EPS) return this.close(tSec);
    if (value >= this.nadir + rules.dropPoints - EPS) {
      if (this.riseSec === 0) {
        this.riseStartTSec = tSec;
        this.riseLow = value;
      }
      this.riseSec += this.periodSec;
      this.riseLow = Math.min(this.riseLow, value);
      this.trackDeep(value);
      if (this.riseSec >= rules.recoveryHoldSec - EPS) {
        this.close(this.riseStartTSec);
        this.reFallLimit = this.riseLow - rules.dropPoints;
      }
      return;
    }
    this.riseSec = 0;
    this.countBelow(value);
  }

  close(endTSec: number): void {
    if (this.confirmed) {
      const { startTSec, nadir, baseline, deep } = this;
      this.events.push({ startTSec, endTSec, nadirSpo2: nadir, baselineSpo2: baseline, deep });
    }
    this.open = false;
  }

  private countBelow(value: number): void {
    this.nadir = Math.min(this.nadir, value);
    this.belowSec += this.periodSec;
    this.confirmed = this.belowSec >= this.rules.minDurationSec - EPS;
    this.trackDeep(value);
  }

  /** ODI4 needs its own unbroken run ≥ deepDropPoints below the same baseline. */
  private trackDeep(value: number): void {
    const isDeep = value <= this.baseline - this.rules.deepDropPoints + EPS;
    this.deepRunSec = isDeep ? this.deepRunSec + this.periodSec : 0;
    this.deep = this.deep || this.deepRunSec >= this.rules.minDurationSec - EPS;
  }
}

/**
 * One pass over time-ordered VALID samples (artefact already removed) with a sliding-window sum for the baseline,
 * so 12 h at 1 Hz costs O(n).
 */
export function detectDesaturations(
  tSec: Float64Array,
  spo2: Float64Array,
  samplePeriodSec: number,
  rules: DesaturationRules = DEFAULT_DESATURATION_RULES,
): DesaturationEvent[] {
  const events: DesaturationEvent[] = [];
  const fall = new FallTracker(rules, samplePeriodSec, events);
  const minWindowSamples = Math.max(1, (rules.baselineMinCoverage * rules.baselineWindowSec) / samplePeriodSec - EPS);
  let windowStart = 0;
  let windowSum = 0;
  for (let i = 0; i < tSec.length; i += 1) {
    if (i > 0 && tSec[i] - tSec[i - 1] - samplePeriodSec > rules.maxGapSec + EPS) {
      if (fall.open) fall.close(tSec[i - 1] + samplePeriodSec);
      fall.reFallLimit = Infinity;
    }
    while (tSec[windowStart] < tSec[i] - rules.baselineWindowSec - EPS) {
      windowSum -= spo2[windowStart];
      windowStart += 1;
    }
    if (fall.open) fall.step(tSec[i], spo2[i]);
    const windowCount = i - windowStart;
    const baseline = windowSum / windowCount;
    const below = spo2[i] <= baseline - rules.dropPoints + EPS;
    if (!below) fall.reFallLimit = Infinity;
    if (!fall.open && windowCount >= minWindowSamples && below && spo2[i] <= fall.reFallLimit + EPS) {
      fall.begin(tSec[i], spo2[i], baseline);
    }
    windowSum += spo2[i];
  }
  if (fall.open) fall.close(tSec[tSec.length - 1] + samplePeriodSec);
  return events;
}
