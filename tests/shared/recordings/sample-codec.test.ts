import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { OximetrySample } from '../../../shared/clinical/oximetry-samples';
import { decodeSamples, encodeSamples } from '../../../shared/recordings/sample-codec';

const value = fc.oneof(fc.integer({ min: 0, max: 65533 }).map((k) => k / 10), fc.constant(null), fc.constant(Number.NaN));

describe('compact sample storage', () => {
  it('when samples at the stored resolution are encoded, then they decode back exactly', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ tSec: fc.integer({ min: 0, max: 26 * 3600 * 1000 }).map((ms) => ms / 1000), spo2: value, pulse: value, flagged: fc.boolean() }), { maxLength: 200 }),
        (samples: OximetrySample[]) => {
          expect(decodeSamples(encodeSamples(samples))).toEqual(samples);
        },
      ),
    );
  });

  it('when one sample is encoded, then the bytes follow layout 1 (little-endian, tenths, 0xFFFF missing)', () => {
    const e = encodeSamples([{ tSec: 1.5, spo2: 97.3, pulse: null, flagged: true }]);
    expect([...e.offsets]).toEqual([0xdc, 0x05, 0, 0]);
    expect([...e.spo2]).toEqual([0xcd, 0x03]);
    expect([...e.pulse]).toEqual([0xff, 0xff]);
    expect([...e.flags]).toEqual([1]);
    expect([...encodeSamples([{ tSec: 0, spo2: -1, pulse: 7000, flagged: false }]).spo2]).toEqual([0xfe, 0xff]);
  });

  it('when stored arrays disagree with the count, then decoding refuses instead of guessing', () => {
    const e = encodeSamples([{ tSec: 0, spo2: 97, pulse: 140 }, { tSec: 1, spo2: 97, pulse: 140 }]);
    expect(() => decodeSamples({ ...e, spo2: e.spo2.subarray(0, 2) })).toThrow(RangeError);
    expect(() => decodeSamples({ ...e, count: 3 })).toThrow(RangeError);
  });
});
