import { spawn, type ChildProcess } from 'node:child_process';

export interface ChildSpec {
  name: string;
  command: string;
  args: string[];
}

export interface SuperviseOptions {
  /** First restart delay; each further crash of the same child within the window doubles it, up to maxDelayMs. */
  initialDelayMs: number;
  maxDelayMs: number;
  /** This many crashes of one child within windowMs is a crash loop: everything stops. */
  crashLimit: number;
  windowMs: number;
  /** How long a child may take to stop after SIGTERM before it is killed. */
  stopTimeoutMs: number;
  log(line: string): void;
  now?: () => number;
}

export const DEFAULT_OPTIONS: Omit<SuperviseOptions, 'log'> = { initialDelayMs: 500, maxDelayMs: 15_000, crashLimit: 5, windowMs: 60_000, stopTimeoutMs: 15_000 };

export type Ending = { reason: 'stopped' } | { reason: 'crash-loop'; name: string };

export interface Supervisor {
  pids(): Record<string, number | undefined>;
  stop(): Promise<void>;
  done: Promise<Ending>;
}

interface Slot {
  spec: ChildSpec;
  child: ChildProcess | null;
  crashes: number[];
  timer: NodeJS.Timeout | null;
}

/** The delay before restart number `crashesInWindow` (1-based) of one child. */
export function restartDelay(crashesInWindow: number, o: Pick<SuperviseOptions, 'initialDelayMs' | 'maxDelayMs'>): number {
  return Math.min(o.maxDelayMs, o.initialDelayMs * 2 ** Math.max(0, crashesInWindow - 1));
}

/**
 * Runs the children and restarts one that ends on its own, with backoff and a log line; the others keep running.
 * Everything stops on stop() (Ctrl-C) or when one child crashes `crashLimit` times within `windowMs`. Children get
 * their own process group, so a Ctrl-C in the terminal reaches only the supervisor, which stops them in order.
 */
export function supervise(specs: ChildSpec[], options: SuperviseOptions): Supervisor {
  const o = options;
  const now = o.now ?? Date.now;
  const slots = specs.map<Slot>((spec) => ({ spec, child: null, crashes: [], timer: null }));
  let stopping: Promise<void> | null = null;
  let finish!: (e: Ending) => void;
  const done = new Promise<Ending>((resolve) => (finish = resolve));

  function start(slot: Slot) {
    slot.timer = null;
    const child = spawn(slot.spec.command, slot.spec.args, { stdio: ['ignore', 'inherit', 'inherit'], detached: true });
    slot.child = child;
    child.once('error', (err) => o.log(`${slot.spec.name} could not start: ${err.message}`));
    child.once('exit', (code, signal) => {
      if (slot.child === child) slot.child = null;
      if (stopping) return;
      const at = now();
      slot.crashes = [...slot.crashes.filter((t) => at - t < o.windowMs), at];
      const how = signal ? `signal ${signal}` : `code ${code}`;
      if (slot.crashes.length >= o.crashLimit) {
        o.log(`${slot.spec.name} ended (${how}) ${slot.crashes.length} times within ${Math.round(o.windowMs / 1000)} s; stopping everything`);
        void stopAll().then(() => finish({ reason: 'crash-loop', name: slot.spec.name }));
        return;
      }
      const delay = restartDelay(slot.crashes.length, o);
      o.log(`${slot.spec.name} ended (${how}); restarting in ${delay} ms (${slot.crashes.length} of ${o.crashLimit} allowed within ${Math.round(o.windowMs / 1000)} s)`);
      slot.timer = setTimeout(() => start(slot), delay);
    });
  }

  function stopChild(slot: Slot): Promise<void> {
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    const child = slot.child;
    if (!child || child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
    return new Promise<void>((resolve) => {
      const force = setTimeout(() => child.kill('SIGKILL'), o.stopTimeoutMs);
      child.once('exit', () => {
        clearTimeout(force);
        resolve();
      });
      child.kill('SIGTERM');
    });
  }

  function stopAll(): Promise<void> {
    stopping ??= Promise.all(slots.map(stopChild)).then(() => undefined);
    return stopping;
  }

  for (const slot of slots) start(slot);
  return {
    pids: () => Object.fromEntries(slots.map((s) => [s.spec.name, s.child?.pid])),
    async stop() {
      await stopAll();
      finish({ reason: 'stopped' });
    },
    done,
  };
}
