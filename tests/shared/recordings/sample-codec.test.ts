import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { OximetrySample } from '@shared/clinical/oximetry-samples';
import { decodeSamples, encodeSamples } from '@shared/recordings/sample-codec';

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

  it('when every stored array or the count disagrees, then decoding refuses, one array at a time', () => {
    // Stored data that cannot be trusted is never analysed (DEVELOPERS.md "What is kept"): each array is checked.
    const e = encodeSamples([{ tSec: 0, spo2: 97, pulse: 140 }, { tSec: 1, spo2: 96, pulse: 141 }]);
    expect(decodeSamples(e)).toHaveLength(2);
    for (const part of ['offsets', 'spo2', 'pulse', 'flags'] as const) {
      expect(() => decodeSamples({ ...e, [part]: e[part].subarray(1) }), part).toThrow('The stored sample arrays do not match the sample count');
    }
    expect(() => decodeSamples({ ...e, count: 1.5 })).toThrow(RangeError);
    expect(() => decodeSamples({ ...e, count: -1 })).toThrow(RangeError);
    const empty = encodeSamples([]);
    expect(decodeSamples(empty)).toEqual([]);
  });

  it('when a time is outside what 32-bit milliseconds hold (about 24.8 days), then encoding refuses it', () => {
    // Layout 1 stores Int32 milliseconds: −2^31 … 2^31 − 1 (the layout comment above encodeSamples).
    const at = (tSec: number) => [{ tSec, spo2: 97, pulse: 140 }];
    expect(decodeSamples(encodeSamples(at(2147483.647)))[0].tSec).toBe(2147483.647);
    expect(decodeSamples(encodeSamples(at(-2147483.648)))[0].tSec).toBe(-2147483.648);
    expect(() => encodeSamples(at(2147483.648))).toThrow('A sample time is outside the storable range');
    expect(() => encodeSamples(at(-2147483.649))).toThrow(RangeError);
    expect(() => encodeSamples(at(Number.NaN))).toThrow(RangeError);
  });

  it('when a value is at the edge of the storable range, then 0 and 6553.3 are kept and beyond is an artefact', () => {
    const one = (spo2: number) => decodeSamples(encodeSamples([{ tSec: 0, spo2, pulse: null }]))[0].spo2;
    expect(one(0)).toBe(0);
    expect(one(6553.3)).toBe(6553.3);
    expect(one(6553.4)).toBeNaN();
    expect(one(-0.1)).toBeNaN();
  });
});
