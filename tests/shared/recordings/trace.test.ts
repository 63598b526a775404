import { describe, expect, it } from 'vitest';
import { decimateTrace, TRACE_MAX_POINTS } from '../../../shared/recordings/trace';
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
    expect(points[3]).toEqual({ tSec: 9, spo2Min: 96, spo2Mean: 96 });
    expect(points[4]).toEqual({ tSec: 12, spo2Min: 96, spo2Mean: 96 });
    expect(decimateTrace(steadySamples(120, [[60, { spo2: null }], [61, { spo2: null }], [62, { spo2: null }]]), 40)[20]).toEqual({ tSec: 60, spo2Min: null, spo2Mean: null });
  });

  it('when a recording is short, then buckets are single seconds', () => {
    expect(decimateTrace(steadySamples(60))).toHaveLength(60);
    expect(decimateTrace([])).toEqual([]);
  });
});
