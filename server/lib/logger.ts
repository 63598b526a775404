import { pino, type DestinationStream, type Logger as Pino } from 'pino';
import { redactValue, scrubText } from './redact';

// JSON lines through pino. Every field and message passes redactValue/scrubText first, so a name, phone number,
// e-mail address or SpO2 value given to the logger by mistake is masked before it is written.
export type Level = 'debug' | 'info' | 'warn' | 'error' | 'silent';

export interface Logger {
  debug(msg: string, fields?: Record<string, unknown>): void;
  info(msg: string, fields?: Record<string, unknown>): void;
  warn(msg: string, fields?: Record<string, unknown>): void;
  error(msg: string, fields?: Record<string, unknown>): void;
  /** A logger whose lines all carry these fields (for example the request id). */
  child(fields: Record<string, unknown>): Logger;
  /** The pino instance underneath, for pino-http. */
  readonly pino: Pino;
}

function wrap(base: Pino): Logger {
  const at = (level: 'debug' | 'info' | 'warn' | 'error') => (msg: string, fields?: Record<string, unknown>) => {
    if (!base.isLevelEnabled(level)) return;
    base[level]((fields ? redactValue(fields) : {}) as object, scrubText(msg));
  };
  return {
    debug: at('debug'), info: at('info'), warn: at('warn'), error: at('error'),
    child: (fields) => wrap(base.child(redactValue(fields) as Record<string, unknown>)),
    pino: base,
  };
}

export function createLogger(level: Level, name: string, destination?: DestinationStream): Logger {
  const base = pino(
    {
      name,
      level,
      base: { pid: process.pid, name },
      timestamp: pino.stdTimeFunctions.isoTime,
      formatters: { level: (label) => ({ level: label }) },
      // pino's own serialisers for req/res/err run before our hook; scrub whatever they produce too.
      hooks: {
        logMethod(args, method) {
          const [first, ...rest] = args as unknown[];
          if (typeof first === 'object' && first !== null) return method.apply(this, [redactValue(first) as object, ...rest.map((r) => (typeof r === 'string' ? scrubText(r) : r))] as never);
          return method.apply(this, args.map((r) => (typeof r === 'string' ? scrubText(r) : r)) as never);
        },
      },
    },
    destination ?? pino.destination({ dest: 1, sync: false }),
  );
  return wrap(base);
}

/** A listener that logs at most once per period (a connection error repeats on every retry while it lasts). */
export function logEvery<A extends unknown[]>(periodMs: number, log: (...args: A) => void, now: () => number = Date.now): (...args: A) => void {
  let last = -Infinity;
  return (...args: A) => {
    const t = now();
    if (t - last < periodMs) return;
    last = t;
    log(...args);
  };
}
