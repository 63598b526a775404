// A stand-in for a busy worker on the same machine: analyses a 24-hour, 1 Hz overnight trace again and again until
// it is killed, reporting how many it finished. Used by bench/scale.bench.ts for "p99 while a recording is analysed".
import { summariseOximetry } from '@shared/clinical/oximetry';
import { buildNoisyTrace } from '../../tests/shared/clinical/helpers/synthetic-oximetry';

const day = buildNoisyTrace(86_400);
let done = 0;
process.on('SIGTERM', () => {
  process.stdout.write(`${done}\n`);
  process.exit(0);
});
process.send?.('ready');
for (;;) {
  summariseOximetry(day);
  done++;
  // Let the SIGTERM handler run between analyses.
  await new Promise((r) => setImmediate(r));
}
