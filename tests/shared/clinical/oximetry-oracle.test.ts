import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { summariseOximetry } from '@shared/clinical/oximetry';
import { DEFAULT_ARTEFACT_RULES, type ArtefactRules, type OximetrySample } from '@shared/clinical/oximetry-samples';

/*
 * The summary figures against a reference written the slow, obvious way: one sample at a time, straight from the
 * definitions, sharing no code with shared/clinical. The other property tests compare the code with itself
 * (across orders and chunkings), so a rule applied wrongly the same way every time passes them; these do not.
 *
 * Definitions (docs/clinical-sources.md §5.1): artefact-free time = valid samples × sample period (Urschitz 2003 [C]);
 * "% time < 90 %" counts readings strictly below the threshold (guideline wording [C]); mean, median and minimum
 * SpO2 are over valid samples only [C]. One sample per instant: a valid reading beats an artefact, and of two valid
 * readings the lower SpO2 is kept, so a dip is never lost to a duplicate (common practice).
 */

interface Reference {
  samplePeriodSec: number;
  sampleCount: number;
  validSampleCount: number;
  validMinutes: number;
  meanSpo2: number | null;
  medianSpo2: number | null;
  minSpo2: number | null;
  percentTimeBelow90: number | null;
  percentTimeBelow92: number | null;
  percentTimeBelow93: number | null;
  meanPulse: number | null;
}

function validByHand(sample: OximetrySample, rules: ArtefactRules): boolean {
  if (sample.flagged) return false;
  const { spo2, pulse } = sample;
  if (typeof spo2 !== 'number' || Number.isNaN(spo2) || spo2 === Infinity || spo2 === -Infinity) return false;
  if (spo2 < rules.spo2MinPercent) return false;
  if (spo2 > rules.spo2MaxPercent) return false;
  if (pulse === null) return true;
  if (Number.isNaN(pulse) || pulse === Infinity || pulse === -Infinity) return false;
  return !(pulse < rules.pulseMinBpm) && !(pulse > rules.pulseMaxBpm);
}

/** Of the readings at one instant: any valid one, the lowest SpO2 first, then a pulse over none, the lower pulse. */
function keptAtInstant(readings: OximetrySample[], rules: ArtefactRules): OximetrySample {
  const valid = readings.filter((r) => validByHand(r, rules));
  if (valid.length === 0) return readings[0];
  let best = valid[0];
  for (const r of valid.slice(1)) {
    const lowerSpo2 = (r.spo2 as number) < (best.spo2 as number);
    const sameSpo2 = r.spo2 === best.spo2;
    const betterPulse = best.pulse === null ? r.pulse !== null : r.pulse !== null && r.pulse < best.pulse;
    if (lowerSpo2 || (sameSpo2 && betterPulse)) best = r;
  }
  return best;
}

function medianByHand(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const half = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[half] : (sorted[half - 1] + sorted[half]) / 2;
}

function referenceSummary(samples: OximetrySample[], rules: ArtefactRules, periodSec?: number): Reference {
  const byInstant = new Map<number, OximetrySample[]>();
  for (const s of samples) byInstant.set(s.tSec, [...(byInstant.get(s.tSec) ?? []), s]);
  const instants = [...byInstant.keys()].sort((a, b) => a - b);
  const spacings = instants.slice(1).map((t, i) => t - instants[i]);
  const samplePeriodSec = periodSec ?? (spacings.length === 0 ? 1 : medianByHand(spacings));
  const kept = instants.map((t) => keptAtInstant(byInstant.get(t)!, rules)).filter((s) => validByHand(s, rules));
  const spo2 = kept.map((s) => s.spo2 as number);
  const pulses = kept.filter((s) => s.pulse !== null).map((s) => s.pulse as number);
  const share = (threshold: number) => (100 * spo2.filter((v) => v < threshold).length) / spo2.length;
  const none = spo2.length === 0;
  return {
    samplePeriodSec,
    sampleCount: instants.length,
    validSampleCount: spo2.length,
    validMinutes: (spo2.length * samplePeriodSec) / 60,
    meanSpo2: none ? null : spo2.reduce((a, b) => a + b, 0) / spo2.length,
    medianSpo2: none ? null : medianByHand(spo2),
    minSpo2: none ? null : Math.min(...spo2),
    percentTimeBelow90: none ? null : share(90),
    percentTimeBelow92: none ? null : share(92),
    percentTimeBelow93: none ? null : share(93),
    meanPulse: pulses.length === 0 ? null : pulses.reduce((a, b) => a + b, 0) / pulses.length,
  };
}

function expectSameFigures(actual: Reference, expected: Reference): void {
  for (const key of Object.keys(expected) as (keyof Reference)[]) {
    const want = expected[key];
    const got = actual[key];
    if (want === null || got === null) expect({ [key]: got }).toEqual({ [key]: want });
    else expect(got, key).toBeCloseTo(want, 9);
  }
}

// Readings clustered on the thresholds and the artefact limits, where a "<" turned "≤" or a wrong bound shows.
const spo2Arbitrary = fc.oneof(
  { weight: 12, arbitrary: fc.integer({ min: 86, max: 100 }) },
  { weight: 4, arbitrary: fc.constantFrom(89.9, 90, 90.1, 91.9, 92, 92.1, 92.9, 93, 93.1) },
  { weight: 2, arbitrary: fc.constantFrom(49.9, 50, 55, 99.9, 100, 100.1) },
  { weight: 1, arbitrary: fc.constantFrom(null, 0, Number.NaN, 120) },
);
const pulseArbitrary = fc.oneof(
  { weight: 10, arbitrary: fc.integer({ min: 90, max: 180 }) },
  { weight: 2, arbitrary: fc.constantFrom(39.9, 40, 250, 250.1, Number.NaN) },
  { weight: 2, arbitrary: fc.constant(null) },
);

/** Short traces on a 1, 2 or 0.5 s grid, with gaps, repeated instants and rows in any order. */
const traceArbitrary = fc
  .tuple(
    fc.constantFrom(1, 2, 0.5),
    fc.array(
      fc.record({
        slot: fc.integer({ min: 0, max: 80 }),
        spo2: spo2Arbitrary,
        pulse: pulseArbitrary,
        flagged: fc.oneof({ weight: 8, arbitrary: fc.constant(undefined) }, { weight: 1, arbitrary: fc.boolean() }),
      }),
      { minLength: 0, maxLength: 120 },
    ),
  )
  .map(([period, rows]): OximetrySample[] =>
    rows.map(({ slot, spo2, pulse, flagged }) => ({ tSec: slot * period, spo2, pulse, ...(flagged === undefined ? {} : { flagged }) })),
  );

/** Time-ordered traces with one sample per instant and the odd pause, as most devices write them. */
const orderedTraceArbitrary = fc
  .array(fc.record({ step: fc.oneof({ weight: 9, arbitrary: fc.constant(1) }, { weight: 1, arbitrary: fc.integer({ min: 2, max: 30 }) }), spo2: spo2Arbitrary, pulse: pulseArbitrary }), { minLength: 1, maxLength: 150 })
  .map((rows): OximetrySample[] => {
    let tSec = 0;
    return rows.map(({ step, spo2, pulse }) => ({ tSec: (tSec += step), spo2, pulse }));
  });

const rulesArbitrary: fc.Arbitrary<ArtefactRules> = fc.oneof(
  fc.constant(DEFAULT_ARTEFACT_RULES),
  fc.record({
    spo2MinPercent: fc.constantFrom(50, 60, 70, 88),
    spo2MaxPercent: fc.constantFrom(95, 98, 99, 100),
    pulseMinBpm: fc.constantFrom(40, 60, 100),
    pulseMaxBpm: fc.constantFrom(160, 200, 250),
  }),
);

describe('oximetry summary against a per-sample reference', () => {
  it('when any short trace is summarised with the default rules, then every figure equals the reference', () => {
    fc.assert(
      fc.property(fc.oneof(traceArbitrary, orderedTraceArbitrary), (samples) => {
        expectSameFigures(summariseOximetry(samples), referenceSummary(samples, DEFAULT_ARTEFACT_RULES));
      }),
      { numRuns: 100 },
    );
  });

  it('when the caller gives its own artefact rules, then the figures follow those rules', () => {
    fc.assert(
      fc.property(fc.oneof(traceArbitrary, orderedTraceArbitrary), rulesArbitrary, (samples, artefactRules) => {
        expectSameFigures(summariseOximetry(samples, { artefactRules }), referenceSummary(samples, artefactRules));
      }),
      { numRuns: 60 },
    );
  });

  it('when the sample period is given, then valid time is counted with it', () => {
    fc.assert(
      fc.property(traceArbitrary, fc.constantFrom(0.25, 1, 4), (samples, samplePeriodSec) => {
        expectSameFigures(summariseOximetry(samples, { samplePeriodSec }), referenceSummary(samples, DEFAULT_ARTEFACT_RULES, samplePeriodSec));
      }),
      { numRuns: 50 },
    );
  });

  it('when readings sit exactly on 90, 92 and 93 %, then they are not counted as below', () => {
    // Worked by hand: four valid seconds at 89, 90, 92, 93 → < 90: 1 of 4 = 25 %; < 92: 2 of 4 = 50 %; < 93: 75 %.
    const samples = [89, 90, 92, 93].map((spo2, tSec) => ({ tSec, spo2, pulse: 140 }));
    const summary = summariseOximetry(samples);
    expect([summary.percentTimeBelow90, summary.percentTimeBelow92, summary.percentTimeBelow93]).toEqual([25, 50, 75]);
    expect(summary.medianSpo2).toBe(91); // even count: (90 + 92) ÷ 2, not the upper 92
  });
});
