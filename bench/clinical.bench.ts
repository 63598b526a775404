// Speed of the pure clinical core (docs/service-targets.md P4: analysis of 24 h at 1 Hz in well under 1 s of CPU).
// Prints figures only; never fails on a number.
import { summariseOximetry } from '@shared/clinical/oximetry';
import { convertPrescription } from '@shared/clinical/conversion';
import { buildNoisyTrace } from '../tests/shared/clinical/helpers/synthetic-oximetry';

function median(values: number[]) {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function time(label: string, runs: number, fn: () => unknown) {
  fn();
  const ms: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = process.hrtime.bigint();
    fn();
    ms.push(Number(process.hrtime.bigint() - t) / 1e6);
  }
  console.log(`${label.padEnd(52)} median ${median(ms).toFixed(2)} ms  (min ${Math.min(...ms).toFixed(2)}, ${runs} runs)`);
}

const day = buildNoisyTrace(86_400);
const night = buildNoisyTrace(43_200);
time('oximetry summary, 12 h at 1 Hz (43,200 samples)', 15, () => summariseOximetry(night));
time('oximetry summary, 24 h at 1 Hz (86,400 samples)', 15, () => summariseOximetry(day));
time('prescription conversion with working (1,000 babies)', 15, () => {
  for (let i = 0; i < 1000; i++) {
    convertPrescription({ weightKg: 2 + (i % 40) / 10, flowLpm: 0.25, sourceO2Percent: 100, hospital: { elevationM: 95 }, home: { elevationM: (i * 7) % 2400 } });
  }
});
