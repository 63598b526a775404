import type { OximetrySample } from '@shared/clinical/oximetry-samples';

export interface Dip {
  startTSec: number;
  durationSec: number;
  spo2: number;
}

// docs/clinical-sources.md §5.3 synthetic regression trace: 1 Hz, 3600 s, baseline 97 %; three dips to 93 % for 15 s,
// two to 94 % for 15 s, one to 89 % for 20 s. Dips sit 500 s apart so each one's 120 s baseline window holds only
// baseline samples (the section assumes a fixed baseline of 97).
export const SECTION_5_3_DIPS: Dip[] = [
  { startTSec: 300, durationSec: 15, spo2: 93 },
  { startTSec: 800, durationSec: 15, spo2: 93 },
  { startTSec: 1300, durationSec: 15, spo2: 93 },
  { startTSec: 1800, durationSec: 15, spo2: 94 },
  { startTSec: 2300, durationSec: 15, spo2: 94 },
  { startTSec: 2800, durationSec: 20, spo2: 89 },
];

export function buildTrace(options: { durationSec?: number; baseline?: number; dips?: Dip[]; pulse?: number } = {}) {
  const { durationSec = 3600, baseline = 97, dips = SECTION_5_3_DIPS, pulse = 140 } = options;
  const samples: OximetrySample[] = [];
  for (let tSec = 0; tSec < durationSec; tSec += 1) {
    const dip = dips.find((d) => tSec >= d.startTSec && tSec < d.startTSec + d.durationSec);
    samples.push({ tSec, spo2: dip ? dip.spo2 : baseline, pulse });
  }
  return samples;
}

/** Deterministic pseudo-random overnight trace (no Math.random, so a failure can be replayed). */
export function buildNoisyTrace(sampleCount: number, seed = 1): OximetrySample[] {
  let state = seed >>> 0;
  const next = () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
  const samples: OximetrySample[] = [];
  let spo2 = 96;
  for (let tSec = 0; tSec < sampleCount; tSec += 1) {
    spo2 = Math.min(100, Math.max(80, spo2 + Math.round((next() - 0.5) * 3)));
    if (next() < 0.002) spo2 = 88;
    const flagged = next() < 0.01;
    samples.push({ tSec, spo2: next() < 0.005 ? null : spo2, pulse: 120 + Math.round(next() * 40), flagged });
  }
  return samples;
}
