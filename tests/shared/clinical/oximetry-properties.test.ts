import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { summariseOximetry, summariseOximetryChunks } from '@shared/clinical/oximetry';
import type { OximetrySample } from '@shared/clinical/oximetry-samples';
import { buildTrace } from './helpers/synthetic-oximetry';

// Traces of up to 20 minutes with the odd artefact, long enough for 120 s baselines and real events.
const traceArbitrary = fc
  .array(
    fc.record({
      spo2: fc.oneof(
        { weight: 20, arbitrary: fc.integer({ min: 82, max: 100 }) },
        { weight: 1, arbitrary: fc.constantFrom(null, 0, 120) },
      ),
      pulse: fc.oneof(
        { weight: 20, arbitrary: fc.integer({ min: 90, max: 180 }) },
        { weight: 1, arbitrary: fc.constant(null) },
      ),
      flagged: fc.integer({ min: 0, max: 9 }).map((n) => n === 0),
    }),
    { minLength: 1, maxLength: 1200 },
  )
  .map((rows): OximetrySample[] => rows.map((row, tSec) => ({ tSec, ...row })));

// Random walks make desaturation events likely, unlike independent values.
const walkArbitrary = fc
  .array(fc.integer({ min: -2, max: 2 }), { minLength: 200, maxLength: 1500 })
  .map((steps): OximetrySample[] => {
    let spo2 = 97;
    return steps.map((step, tSec) => {
      spo2 = Math.min(100, Math.max(80, spo2 + step));
      return { tSec, spo2, pulse: 140 };
    });
  });

function shuffled<T>(items: readonly T[], seed: number): T[] {
  const copy = [...items];
  let state = seed >>> 0 || 1;
  for (let i = copy.length - 1; i > 0; i -= 1) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    const j = state % (i + 1);
    [copy[i], copy[j]] = [copy[j], copy[i]];
  }
  return copy;
}

function chunked<T>(items: readonly T[], cuts: number[]): T[][] {
  const points = [...new Set(cuts.map((cut) => cut % (items.length + 1)))].sort((a, b) => a - b);
  const chunks: T[][] = [];
  let from = 0;
  for (const point of points) {
    chunks.push(items.slice(from, point));
    from = point;
  }
  chunks.push(items.slice(from));
  return chunks;
}

describe('oximetry summary: properties', () => {
  it('when samples arrive in any order, then the summary is identical', () => {
    fc.assert(
      fc.property(fc.oneof(traceArbitrary, walkArbitrary), fc.integer(), (samples, seed) => {
        expect(summariseOximetry(shuffled(samples, seed))).toEqual(summariseOximetry(samples));
      }),
      { numRuns: 60 },
    );
  });

  it('when the recording is split into chunks in any order, then the summary is identical', () => {
    fc.assert(
      fc.property(walkArbitrary, fc.array(fc.nat(), { maxLength: 8 }), fc.integer(), (samples, cuts, seed) => {
        const chunks = shuffled(chunked(samples, cuts), seed);
        expect(summariseOximetryChunks(chunks)).toEqual(summariseOximetry(samples));
      }),
      { numRuns: 60 },
    );
  });

  it('when the threshold rises, then time below it never falls, and it stays within 0–100 %', () => {
    fc.assert(
      fc.property(fc.oneof(traceArbitrary, walkArbitrary), (samples) => {
        const s = summariseOximetry(samples);
        if (s.validSampleCount === 0) return;
        const [b90, b92, b93] = [s.percentTimeBelow90, s.percentTimeBelow92, s.percentTimeBelow93] as number[];
        expect(b90).toBeGreaterThanOrEqual(0);
        expect(b90).toBeLessThanOrEqual(b92);
        expect(b92).toBeLessThanOrEqual(b93);
        expect(b93).toBeLessThanOrEqual(100);
        expect(s.minSpo2 as number).toBeLessThanOrEqual(s.medianSpo2 as number);
        expect(s.odi4PerHour as number).toBeLessThanOrEqual(s.odi3PerHour as number);
      }),
    );
  });

  it('when events are found, then each starts ≥ 3 below its baseline, lasts ≥ 10 s and none overlap', () => {
    fc.assert(
      fc.property(walkArbitrary, (samples) => {
        const { odi3Events } = summariseOximetry(samples);
        const byTime = new Map(samples.map((sample) => [sample.tSec, sample.spo2 as number]));
        odi3Events.forEach((event, index) => {
          expect(byTime.get(event.startTSec) as number).toBeLessThanOrEqual(event.baselineSpo2 - 3 + 1e-9);
          expect(event.nadirSpo2).toBeLessThanOrEqual(event.baselineSpo2 - 3 + 1e-9);
          expect(event.endTSec - event.startTSec).toBeGreaterThanOrEqual(10);
          if (index > 0) expect(event.startTSec).toBeGreaterThanOrEqual(odi3Events[index - 1].endTSec);
        });
      }),
    );
  });

  it('when the §5.3 trace is shuffled and chunked, then ODI3 stays 6/h', () => {
    const trace = buildTrace();
    const chunks = chunked(shuffled(trace, 7), [500, 1700, 2900]);
    expect(summariseOximetryChunks(chunks).odi3PerHour).toBeCloseTo(6, 12);
  });
});
