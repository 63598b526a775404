import type { Logger as TypeOrmLogger } from 'typeorm';

/**
 * Logs failed queries without their parameters: parameters carry names, identifiers and SpO2 samples, which must
 * never reach application logs (docs/service-targets.md, audit). The SQL text itself holds only placeholders.
 */
export class SafeQueryLogger implements TypeOrmLogger {
  constructor(private readonly silent = false) {}
  logQuery() {}
  logQuerySlow() {}
  logSchemaBuild() {}
  logMigration(message: string) {
    if (!this.silent) process.stdout.write(`${JSON.stringify({ level: 'info', name: 'db', msg: message })}\n`);
  }
  log(level: 'log' | 'info' | 'warn', message: unknown) {
    if (!this.silent && level === 'warn') process.stderr.write(`${JSON.stringify({ level, name: 'db', msg: String(message) })}\n`);
  }
  logQueryError(error: string | Error, query: string) {
    if (this.silent) return;
    const code = typeof error === 'string' ? undefined : (error as { code?: string }).code;
    process.stderr.write(`${JSON.stringify({ level: 'warn', name: 'db', msg: 'query failed', code, query: query.slice(0, 160) })}\n`);
  }
}
