export interface DesaturationRules {
  /** Baseline = mean of the valid SpO2 samples in this many seconds before the fall began. */
  baselineWindowSec: number;
  /**
   * Share of the window that must hold valid samples before a baseline is trusted; at the start of a recording or
   * after a long artefact a handful of samples would make a fragile baseline, so no event can begin there.
   */
  baselineMinCoverage: number;
  /** Points below baseline that make a fall (ODI3). */
  dropPoints: number;
  /** Points below the same baseline that make the fall count for ODI4 too. */
  deepDropPoints: number;
  /** A fall must stay at or below baseline − drop for this long (10 s is common in adult scoring, from memory). */
  minDurationSec: number;
  /** The event ends when SpO2 is back within this many points of its baseline; until then it counts once. */
  recoveryWithinPoints: number;
}

export const DEFAULT_DESATURATION_RULES: DesaturationRules = Object.freeze({
  baselineWindowSec: 120,
  baselineMinCoverage: 0.5,
  dropPoints: 3,
  deepDropPoints: 4,
  minDurationSec: 10,
  recoveryWithinPoints: 1,
});

export interface DesaturationEvent {
  startTSec: number;
  /** tSec of the first sample back within the recovery margin, or the end of the last sample's period. */
  endTSec: number;
  nadirSpo2: number;
  baselineSpo2: number;
  /** True when the event also held ≥ deepDropPoints below its baseline for the minimum duration (ODI4). */
  deep: boolean;
}

// SpO2 values are often integers, but averages are not; this keeps 94 ≤ 97 − 3 true when the mean is 96.99999999.
const EPS = 1e-9;

/**
 * The fall being followed; mutated in place so a 12 h trace allocates nothing per sample. ODI4 events are the ODI3
 * events that also went ≥ 4 points down against the same fixed baseline. Detecting them separately would give each
 * index its own baselines and event boundaries, and a long fall could then count twice for ODI4 but once for ODI3.
 */
class FallTracker {
  open = false;
  private confirmed = false;
  private startTSec = 0;
  private baseline = 0;
  private nadir = 0;
  private belowSec = 0;
  private deepRunSec = 0;
  private deep = false;

  constructor(
    private readonly rules: DesaturationRules,
    private readonly samplePeriodSec: number,
    private readonly events: DesaturationEvent[],
  ) {}

  begin(tSec: number, value: number, baseline: number): void {
    this.open = true;
    this.startTSec = tSec;
    this.baseline = baseline;
    this.nadir = value;
    this.belowSec = 0;
    this.deepRunSec = 0;
    this.deep = false;
    this.countSample(value);
  }

  /** Follows the open fall by one sample; afterwards `open` says whether it is still going. */
  step(tSec: number, value: number): void {
    if (this.confirmed && value >= this.baseline - this.rules.recoveryWithinPoints - EPS) return this.close(tSec);
    if (!this.confirmed && value > this.baseline - this.rules.dropPoints + EPS) {
      this.open = false;
      return;
    }
    this.countSample(value);
  }

  close(endTSec: number): void {
    if (this.confirmed) {
      const { startTSec, nadir, baseline, deep } = this;
      this.events.push({ startTSec, endTSec, nadirSpo2: nadir, baselineSpo2: baseline, deep });
    }
    this.open = false;
  }

  private countSample(value: number): void {
    const minSec = this.rules.minDurationSec - EPS;
    this.nadir = Math.min(this.nadir, value);
    if (!this.confirmed) this.belowSec += this.samplePeriodSec;
    this.confirmed = this.belowSec >= minSec;
    const isDeep = value <= this.baseline - this.rules.deepDropPoints + EPS;
    this.deepRunSec = isDeep ? this.deepRunSec + this.samplePeriodSec : 0;
    this.deep = this.deep || this.deepRunSec >= minSec;
  }
}

/**
 * One pass over time-ordered valid samples with a sliding-window sum for the baseline, so 12 h at 1 Hz costs
 * O(n). Artefact samples are absent from the input: they neither break nor extend a fall. The baseline is taken
 * when the fall begins and held fixed for the whole event.
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
    while (windowStart < i && tSec[windowStart] < tSec[i] - rules.baselineWindowSec - EPS) {
      windowSum -= spo2[windowStart];
      windowStart += 1;
    }
    if (fall.open) fall.step(tSec[i], spo2[i]);
    const windowCount = i - windowStart;
    const baseline = windowSum / windowCount;
    if (!fall.open && windowCount >= minWindowSamples && spo2[i] <= baseline - rules.dropPoints + EPS) {
      fall.begin(tSec[i], spo2[i], baseline);
    }
    windowSum += spo2[i];
  }
  if (fall.open) fall.close(tSec[tSec.length - 1] + samplePeriodSec);
  return events;
}
