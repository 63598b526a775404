import { describe, expect, it } from 'vitest';
import { decimateTrace, TRACE_MAX_POINTS } from '@shared/recordings/trace';
import { steadySamples } from '../../fixtures/recordings/build-csv';

describe('trace for display', () => {
  it('when a 26 h night at 1 Hz is squeezed, then at most 2,000 points remain and a 1 s dip still shows at its bucket', () => {
    const samples = steadySamples(26 * 3600, [[50_000, { spo2: 81 }]]);
    const points = decimateTrace(samples);
    expect(points.length).toBeLessThanOrEqual(TRACE_MAX_POINTS);
    expect(points.length).toBeGreaterThan(TRACE_MAX_POINTS * 0.9);
    const bucket = points.findLast((p) => p.tSec <= 50_000)!;
    expect(bucket.spo2Min).toBe(81);
    expect(bucket.spo2Mean).toBeGreaterThan(95);
    expect(Math.min(...points.map((p) => p.spo2Min ?? 100))).toBe(81);
  });

  it('when samples are artefacts (flagged, 0, missing), then they are left out and an empty bucket is a gap', () => {
    const samples = steadySamples(120, [[10, { spo2: 0 }], [11, { flagged: true, spo2: 70 }], [12, { spo2: null }]]);
    const points = decimateTrace(samples, 40);
    expect(points).toHaveLength(40);
    expect(points[3]).toEqual({ tSec: 9, spo2Min: 96, spo2Mean: 96, pulseMean: 135 });
    expect(points[4]).toEqual({ tSec: 12, spo2Min: 96, spo2Mean: 96, pulseMean: 135 });
    expect(decimateTrace(steadySamples(120, [[60, { spo2: null }], [61, { spo2: null }], [62, { spo2: null }]]), 40)[20]).toEqual({ tSec: 60, spo2Min: null, spo2Mean: null, pulseMean: null });
  });

  it('when a recording is short, then buckets are single seconds', () => {
    expect(decimateTrace(steadySamples(60))).toHaveLength(60);
    expect(decimateTrace([])).toEqual([]);
  });

  it('when the recording does not start at 0 s, then buckets start at the first sample and the last sample is kept', () => {
    // Ordered samples from the reader always start at 0, but a chunk of a night starts later (the chart of a part).
    const samples = steadySamples(200).slice(100).map((s, i) => (i === 99 ? { ...s, spo2: 85 } : s));
    const points = decimateTrace(samples, 10);
    expect(points).toHaveLength(10);
    expect(points[0].tSec).toBe(100);
    expect(points[9]).toEqual({ tSec: 190, spo2Min: 85, spo2Mean: 94.9, pulseMean: 135 });
  });

  it('when a span is one second more than the points allow, then buckets widen to 2 s rather than exceed the points', () => {
    // A chart needs no more points than it has room for (TRACE_MAX_POINTS rule): 11 s at 10 points → 6 buckets of 2 s.
    const points = decimateTrace(steadySamples(11), 10);
    expect(points.map((p) => p.tSec)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(decimateTrace(steadySamples(10), 10)).toHaveLength(10);
  });

  it('when samples carry a pulse, then each bucket has the mean pulse of its valid samples; artefacts and missing pulses are left out', () => {
    // Artefact rules (docs/clinical-sources.md §5.1, the analysis's own): a pulse outside 40–250 bpm makes the whole sample
    // an artefact; a missing pulse does not (some exports carry none), so that sample counts for SpO2 only.
    const samples = steadySamples(12, [[0, { pulse: 140 }], [1, { pulse: 151 }], [3, { pulse: 300, spo2: 80 }], [4, { pulse: null }], [5, { pulse: null }], [6, { pulse: 39 }]]);
    const points = decimateTrace(samples, 4);
    expect(points.map((p) => p.tSec)).toEqual([0, 3, 6, 9]);
    expect(points[0]).toEqual({ tSec: 0, spo2Min: 96, spo2Mean: 96, pulseMean: 142 }); // (140 + 151 + 135) / 3
    expect(points[1]).toEqual({ tSec: 3, spo2Min: 96, spo2Mean: 96, pulseMean: null }); // 300 bpm out, the others have none
    expect(points[2]).toEqual({ tSec: 6, spo2Min: 96, spo2Mean: 96, pulseMean: 135 }); // 39 bpm out with its SpO2
    expect(decimateTrace(steadySamples(2, [[0, { pulse: 140 }], [1, { pulse: 141 }]]), 1)[0].pulseMean).toBe(140.5);
  });
});
