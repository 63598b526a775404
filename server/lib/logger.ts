// Minimal structured logger. Never pass SpO2 values, names or other identifiers into it.
type Level = 'debug' | 'info' | 'warn' | 'error' | 'silent';
const order: Record<Level, number> = { debug: 10, info: 20, warn: 30, error: 40, silent: 99 };

export interface Logger {
  debug(msg: string, fields?: Record<string, unknown>): void;
  info(msg: string, fields?: Record<string, unknown>): void;
  warn(msg: string, fields?: Record<string, unknown>): void;
  error(msg: string, fields?: Record<string, unknown>): void;
}

export function createLogger(level: Level, name: string): Logger {
  const write = (l: Exclude<Level, 'silent'>) => (msg: string, fields?: Record<string, unknown>) => {
    if (order[l] < order[level]) return;
    const line = JSON.stringify({ t: new Date().toISOString(), level: l, name, msg, ...fields });
    (l === 'error' || l === 'warn' ? process.stderr : process.stdout).write(line + '\n');
  };
  return { debug: write('debug'), info: write('info'), warn: write('warn'), error: write('error') };
}
