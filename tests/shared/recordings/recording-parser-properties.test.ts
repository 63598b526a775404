import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { OximetrySample } from '@shared/clinical/oximetry-samples';
import { createRecordingParser, parseRecordingCsv } from '@shared/recordings/recording-parser';
import { csvFromSamples } from '../../fixtures/recordings/build-csv';

// Values at the stored resolution (0.1), with the odd missing one; times at 1 ms, strictly increasing from 0.
const value = fc.oneof(
  { weight: 8, arbitrary: fc.integer({ min: 0, max: 2500 }).map((k) => k / 10) },
  { weight: 1, arbitrary: fc.constant(null) },
);
const night = fc
  .array(fc.record({ gapMs: fc.integer({ min: 1, max: 4000 }), spo2: value, pulse: value, flagged: fc.boolean() }), { minLength: 60, maxLength: 240 })
  .map((rows): OximetrySample[] => {
    let ms = -rows[0].gapMs;
    return rows.map(({ gapMs, spo2, pulse, flagged }) => {
      ms += gapMs;
      return { tSec: ms / 1000, spo2, pulse, flagged };
    });
  });
const shape = fc.record({
  time: fc.constantFrom('iso' as const, 'seconds' as const),
  flaggedStatus: fc.constantFrom('probe off', 'LOW, SIGNAL', '"artefact"', 'x'),
  eol: fc.constantFrom('\n', '\r\n'),
});

function inChunks(text: string, points: number[]) {
  const parser = createRecordingParser();
  const at = [...new Set(points.map((p) => p % (text.length + 1)))].sort((a, b) => a - b);
  let from = 0;
  for (const p of [...at, text.length]) {
    const early = parser.push(text.slice(from, p));
    if (early) return { ok: false as const, problem: early };
    from = p;
  }
  return parser.finish();
}

describe('recording parser: properties', () => {
  it('when generated samples are written as a file, then reading it gives back exactly those samples', () => {
    fc.assert(
      fc.property(night, shape, (samples, s) => {
        const result = parseRecordingCsv(csvFromSamples(samples, s));
        expect(result.ok && result.recording.samples).toEqual(samples);
      }),
      { numRuns: 300 },
    );
  });

  it('when given arbitrary text, with or without our header, then it returns a recording or a typed refusal and never throws', () => {
    const codes = ['empty_file', 'malformed_csv', 'wrong_columns', 'unreadable_rows', 'too_short', 'too_long'];
    const text = fc.oneof(fc.string({ unit: 'binary', maxLength: 300 }), fc.string({ unit: fc.constantFrom('1', '9', '.', ',', '"', '\n', 'T', '-', ':', 'Z', ' '), maxLength: 300 }));
    fc.assert(
      fc.property(fc.constantFrom('', 'timestamp,spo2,pulse\n', 'timestamp,spo2,pulse,status\n'), text, (header, body) => {
        const result = parseRecordingCsv(header + body);
        if (!result.ok) expect(codes).toContain(result.problem.code);
      }),
      { numRuns: 2000 },
    );
  });

  it('when a file is fed in chunks cut anywhere, then the result is the same as reading it whole', () => {
    const damaged = fc.tuple(night, shape, fc.nat(), fc.constantFrom('', '"', ',', 'x', '\n')).map(([samples, s, at, junk]) => {
      const text = csvFromSamples(samples, s);
      const p = at % (text.length + 1);
      return text.slice(0, p) + junk + text.slice(p);
    });
    fc.assert(
      fc.property(damaged, fc.array(fc.nat(), { maxLength: 8 }), (text, points) => {
        expect(inChunks(text, points)).toEqual(parseRecordingCsv(text));
      }),
      { numRuns: 300 },
    );
  });
});
