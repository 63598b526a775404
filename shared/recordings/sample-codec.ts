import type { OximetrySample } from '../clinical/oximetry-samples';
import { MAX_VALUE_STEPS, VALUE_STEPS_PER_UNIT } from './values';

/**
 * Compact storage of a recording's samples (docs/service-targets.md: never one row per sample). Layout 1, four parallel
 * little-endian arrays, one entry per sample in time order:
 *   offsets  Int32   milliseconds from the earliest sample (Int32 holds 24.8 days; uploads stop at 26 h)
 *   spo2     Uint16  tenths of a percent; 0xFFFF = missing, 0xFFFE = a number outside 0–6553.3 (an artefact)
 *   pulse    Uint16  tenths of a beat per minute; the same two codes
 *   flags    Uint8   bit 0 = flagged by the device
 * A 12 h night at 1 Hz takes 43,200 × 9 bytes ≈ 389 kB.
 */
export const SAMPLE_LAYOUT_VERSION = 1;

export interface EncodedSamples {
  count: number;
  offsets: Uint8Array;
  spo2: Uint8Array;
  pulse: Uint8Array;
  flags: Uint8Array;
}

const MISSING = 0xffff;
const OUT_OF_RANGE = 0xfffe;
const FLAGGED = 1;

function encodeValue(value: number | null): number {
  if (value === null) return MISSING;
  const steps = Math.round(value * VALUE_STEPS_PER_UNIT);
  return steps >= 0 && steps <= MAX_VALUE_STEPS ? steps : OUT_OF_RANGE;
}

function decodeValue(code: number): number | null {
  if (code === MISSING) return null;
  return code === OUT_OF_RANGE ? Number.NaN : code / VALUE_STEPS_PER_UNIT;
}

export function encodeSamples(samples: readonly OximetrySample[]): EncodedSamples {
  const n = samples.length;
  const offsets = new DataView(new ArrayBuffer(n * 4));
  const spo2 = new DataView(new ArrayBuffer(n * 2));
  const pulse = new DataView(new ArrayBuffer(n * 2));
  const flags = new Uint8Array(n);
  for (let i = 0; i < n; i += 1) {
    const s = samples[i];
    const ms = Math.round(s.tSec * 1000);
    if (!(ms >= -0x80000000 && ms <= 0x7fffffff)) throw new RangeError('A sample time is outside the storable range');
    offsets.setInt32(i * 4, ms, true);
    spo2.setUint16(i * 2, encodeValue(s.spo2), true);
    pulse.setUint16(i * 2, encodeValue(s.pulse), true);
    flags[i] = s.flagged ? FLAGGED : 0;
  }
  const bytes = (view: DataView) => new Uint8Array(view.buffer);
  return { count: n, offsets: bytes(offsets), spo2: bytes(spo2), pulse: bytes(pulse), flags };
}

/** Throws on arrays that disagree with the count: stored data that cannot be trusted is never analysed. */
export function decodeSamples(encoded: EncodedSamples): OximetrySample[] {
  const { count: n, offsets, spo2, pulse, flags } = encoded;
  if (!(Number.isInteger(n) && n >= 0) || offsets.byteLength !== n * 4 || spo2.byteLength !== n * 2 || pulse.byteLength !== n * 2 || flags.byteLength !== n) {
    throw new RangeError('The stored sample arrays do not match the sample count');
  }
  const view = (a: Uint8Array) => new DataView(a.buffer, a.byteOffset, a.byteLength);
  const o = view(offsets);
  const s = view(spo2);
  const p = view(pulse);
  // Stryker disable next-line ArrayDeclaration: preallocation only; the loop below writes every index
  const samples = new Array<OximetrySample>(n);
  for (let i = 0; i < n; i += 1) {
    samples[i] = {
      tSec: o.getInt32(i * 4, true) / 1000,
      spo2: decodeValue(s.getUint16(i * 2, true)),
      pulse: decodeValue(p.getUint16(i * 2, true)),
      flagged: (flags[i] & FLAGGED) === FLAGGED,
    };
  }
  return samples;
}
