import { readFileSync } from 'node:fs';
import { DEFAULT_OPTIONS, supervise, type ChildSpec } from './supervise';

// npm start's process runner: the API, the worker and the local fakes, each restarted when it crashes.
// `--spec <file.json>` runs other children (a list of { name, command, args }); `--fast` shortens the delays (tests).
const argv = process.argv.slice(2);
const specFile = argv.includes('--spec') ? argv[argv.indexOf('--spec') + 1] : null;
const node = (name: string, entry: string): ChildSpec => ({ name, command: process.execPath, args: ['--import', 'tsx', entry] });
const specs: ChildSpec[] = specFile
  ? (JSON.parse(readFileSync(specFile, 'utf8')) as ChildSpec[])
  : [node('api', 'server/main.ts'), node('worker', 'worker/main.ts'), node('fake-mail', 'fakes/mail/main.ts'), node('fake-sms', 'fakes/sms/main.ts')];

const stamp = () => new Date().toISOString().slice(11, 19);
const options = argv.includes('--fast') ? { ...DEFAULT_OPTIONS, initialDelayMs: 50, maxDelayMs: 400, stopTimeoutMs: 3000 } : DEFAULT_OPTIONS;
const supervisor = supervise(specs, { ...options, log: (line) => console.log(`[nestflow] ${stamp()} ${line}`) });

let signalled = false;
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
  process.on(signal, () => {
    if (signalled) return;
    signalled = true;
    console.log(`[nestflow] ${stamp()} ${signal}: stopping ${specs.map((s) => s.name).join(', ')}`);
    void supervisor.stop();
  });
}
const ending = await supervisor.done;
process.exit(ending.reason === 'crash-loop' ? 1 : 0);
