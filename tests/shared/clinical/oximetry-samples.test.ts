import { describe, expect, it } from 'vitest';
import {
  DEFAULT_ARTEFACT_RULES,
  isValidSample,
  medianSamplePeriodSec,
  orderSamples,
  type ArtefactRules,
  type OximetrySample,
} from '@shared/clinical/oximetry-samples';

const at = (tSec: number, spo2: number | null, pulse: number | null = 140, flagged?: boolean): OximetrySample => ({
  tSec,
  spo2,
  pulse,
  ...(flagged === undefined ? {} : { flagged }),
});

describe('artefact rules: which samples count as valid time', () => {
  it('when SpO2 is exactly 100 %, then the sample is valid, and just above it is not', () => {
    // A saturation of 100 % is physically possible (the haemoglobin is full); above it is a device error
    // (common practice; artefact rules in docs/clinical-sources.md §5.1 [M]).
    expect(isValidSample(at(0, 100))).toBe(true);
    expect(isValidSample(at(0, 100.1))).toBe(false);
  });

  it('when SpO2 is exactly 50 %, then it is valid, and just below it is probe loss', () => {
    // Default plausibility floor 50 % (common practice: 0 or a very low value is what many devices write for
    // "no reading"; §5.1 "physiologically implausible values" [C for the rule, M for the number]).
    expect(isValidSample(at(0, 50))).toBe(true);
    expect(isValidSample(at(0, 49.9))).toBe(false);
    expect(isValidSample(at(0, 0))).toBe(false);
  });

  it('when SpO2 is missing or not a number, then the sample is not valid time', () => {
    // §5.1: artefact-free recording time counts only real readings (Urschitz 2003 [C]).
    expect(isValidSample(at(0, null))).toBe(false);
    expect(isValidSample(at(0, Number.NaN))).toBe(false);
    expect(isValidSample(at(0, Number.POSITIVE_INFINITY))).toBe(false);
    expect(isValidSample(at(0, Number.NEGATIVE_INFINITY))).toBe(false);
  });

  it('when the pulse is 40 or 250 bpm, then the sample is valid; just outside, it is motion or a lost signal', () => {
    // Default infant pulse window 40–250 bpm (from memory; a pulse outside it means the SpO2 of that moment is
    // not trusted either, §5.1 "implausible values" [C for the rule]).
    expect(isValidSample(at(0, 95, 40))).toBe(true);
    expect(isValidSample(at(0, 95, 250))).toBe(true);
    expect(isValidSample(at(0, 95, 39.9))).toBe(false);
    expect(isValidSample(at(0, 95, 250.1))).toBe(false);
    expect(isValidSample(at(0, 95, Number.NaN))).toBe(false);
    expect(isValidSample(at(0, 95, Number.POSITIVE_INFINITY))).toBe(false);
  });

  it('when the pulse is missing, then the SpO2 still counts (several exports carry no pulse)', () => {
    // Common practice: SpO2-only exports exist; a missing pulse is not evidence of artefact.
    expect(isValidSample(at(0, 95, null))).toBe(true);
  });

  it('when the device flags a sample, then it is excluded whatever its values', () => {
    // §5.1: discard samples flagged by the device (low signal quality, perfusion, sensor off) [M, usual rule].
    expect(isValidSample(at(0, 97, 140, true))).toBe(false);
    expect(isValidSample(at(0, 97, 140, false))).toBe(true);
  });

  it('when the caller gives its own rules, then those rules decide, not the defaults', () => {
    // A programme may narrow the window (policy); the analysis must apply the programme's rules (common practice).
    const strict: ArtefactRules = { spo2MinPercent: 70, spo2MaxPercent: 99, pulseMinBpm: 80, pulseMaxBpm: 200 };
    expect(isValidSample(at(0, 65), strict)).toBe(false);
    expect(isValidSample(at(0, 70), strict)).toBe(true);
    expect(isValidSample(at(0, 99.5), strict)).toBe(false);
    expect(isValidSample(at(0, 99), strict)).toBe(true);
    expect(isValidSample(at(0, 95, 75), strict)).toBe(false);
    expect(isValidSample(at(0, 95, 80), strict)).toBe(true);
    expect(isValidSample(at(0, 95, 210), strict)).toBe(false);
    expect(isValidSample(at(0, 95, 200), strict)).toBe(true);
    expect(DEFAULT_ARTEFACT_RULES).toEqual({ spo2MinPercent: 50, spo2MaxPercent: 100, pulseMinBpm: 40, pulseMaxBpm: 250 });
  });
});

describe('ordering samples: one reading per instant', () => {
  it('when a row is duplicated in an otherwise ordered file, then it is kept once', () => {
    // Exports and joined files repeat rows; a repeated second counted twice would inflate valid time and the share
    // below a threshold (common practice: one sample per instant).
    const ordered = orderSamples([at(0, 97), at(1, 88), at(1, 88), at(2, 97)], DEFAULT_ARTEFACT_RULES);
    expect(ordered.map((s) => s.tSec)).toEqual([0, 1, 2]);
  });

  it('when a flagged low reading and a valid one share an instant, then the valid one is kept', () => {
    // The device's own flag says the low value is not trusted (§5.1 [M]); it must not hide the good reading.
    const ordered = orderSamples([at(1, 97), at(0, 96), at(1, 80, 140, true)], DEFAULT_ARTEFACT_RULES);
    expect(ordered).toEqual([at(0, 96), at(1, 97)]);
    const reversed = orderSamples([at(1, 80, 140, true), at(1, 97), at(0, 96)], DEFAULT_ARTEFACT_RULES);
    expect(reversed).toEqual([at(0, 96), at(1, 97)]);
  });

  it('when two valid readings share an instant, then the lower SpO2 is kept, in any input order', () => {
    // A desaturation metric must not lose the worse of two readings (common practice: err towards the safe side).
    expect(orderSamples([at(1, 97), at(0, 96), at(1, 91)], DEFAULT_ARTEFACT_RULES)[1]).toEqual(at(1, 91));
    expect(orderSamples([at(1, 91), at(0, 96), at(1, 97)], DEFAULT_ARTEFACT_RULES)[1]).toEqual(at(1, 91));
  });

  it('when two readings share an instant and the same SpO2, then the one with a pulse is kept, in any order', () => {
    // Same rule, one level down: a reading with a pulse carries more evidence than one without (common practice).
    const a = at(1, 95, 150);
    const b = at(1, 95, null);
    const c = at(1, 95, 130);
    expect(orderSamples([a, at(0, 96), b, c], DEFAULT_ARTEFACT_RULES)[1]).toEqual(c);
    expect(orderSamples([b, at(0, 96), c, a], DEFAULT_ARTEFACT_RULES)[1]).toEqual(c);
    expect(orderSamples([at(1, 95, null), at(0, 96), at(1, 95, null)], DEFAULT_ARTEFACT_RULES)).toHaveLength(2);
  });

  it('when only missing readings share an instant, then one is kept and the order is still by time', () => {
    const ordered = orderSamples([at(2, 97), at(1, null), at(0, 97), at(1, null, null)], DEFAULT_ARTEFACT_RULES);
    expect(ordered.map((s) => s.tSec)).toEqual([0, 1, 2]);
  });

  it('when validity decides a tie, then the caller’s artefact rules are the ones applied', () => {
    // Under a programme that treats anything above 96 % as artefact, the 97 is not valid and the 95 wins.
    const rules: ArtefactRules = { ...DEFAULT_ARTEFACT_RULES, spo2MaxPercent: 96 };
    expect(orderSamples([at(1, 95, 300), at(0, 96), at(1, 97)], DEFAULT_ARTEFACT_RULES)[1]).toEqual(at(1, 97));
    expect(orderSamples([at(1, 97), at(0, 96), at(1, 95)], rules)[1]).toEqual(at(1, 95));
  });

  it('when the input is already in time order, then a copy is returned, never the caller’s array', () => {
    const input = [at(0, 97), at(1, 96)];
    const ordered = orderSamples(input, DEFAULT_ARTEFACT_RULES);
    expect(ordered).toEqual(input);
    expect(ordered).not.toBe(input);
  });

  it('when a time is not a finite number, then the recording is refused', () => {
    expect(() => orderSamples([at(0, 97), at(Number.NaN, 96)], DEFAULT_ARTEFACT_RULES)).toThrow(RangeError);
    expect(() => orderSamples([at(Number.POSITIVE_INFINITY, 97)], DEFAULT_ARTEFACT_RULES)).toThrow(RangeError);
  });
});

describe('sample period from the median spacing', () => {
  const times = (...tSecs: number[]) => tSecs.map((tSec) => at(tSec, 97));

  it('when a 1 Hz recording has one long pause, then the period is still 1 s', () => {
    // A median ignores the odd gap, which a mean would absorb (common practice: robust statistics).
    expect(medianSamplePeriodSec(times(0, 1, 2, 3, 600, 601, 602))).toBe(1);
  });

  it('when the count of spacings is even, then the median is the mean of the two middle ones', () => {
    // Median of an even count: the average of the two middle values (standard definition).
    expect(medianSamplePeriodSec(times(0, 1, 2, 4, 6))).toBe(1.5);
  });

  it('when spacings arrive unsorted, then they are sorted by value before the middle is taken', () => {
    // Spacings 1, 1, 4, 1, 1 → median 1 (the unsorted middle would be the pause); 2, 10, 2 → median 2.
    expect(medianSamplePeriodSec(times(0, 1, 2, 6, 7, 8))).toBe(1);
    expect(medianSamplePeriodSec(times(0, 2, 12, 14))).toBe(2);
  });

  it('when there are fewer than two samples, then the usual 1 s export rate is assumed', () => {
    // Common practice: overnight exports are 1 Hz.
    expect(medianSamplePeriodSec([])).toBe(1);
    expect(medianSamplePeriodSec(times(5))).toBe(1);
    expect(medianSamplePeriodSec(times(5, 7))).toBe(2);
  });
});
