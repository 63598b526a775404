import { createHash } from 'node:crypto';
import type { Pool, QueryResultRow } from 'pg';
import type { DataSource } from 'typeorm';

// The statements every list page and every signed-in request run are prepared once per database connection and
// then only bound and executed: PostgreSQL parses and plans them once instead of on every request (planning the
// caseload page costs about as much as running it). Only statements that name their columns belong here; one
// reading `table.*` would fail with "cached plan must not change result type" after a migration adds a column.

const KEPT_NAMES = 2_000;
const names = new Map<string, string>();

/** A stable name for a statement's text (the same text gets the same name in every process). */
export function statementName(text: string): string {
  let name = names.get(text);
  if (!name) {
    name = `nf_${createHash('sha1').update(text).digest('hex').slice(0, 20)}`;
    if (names.size >= KEPT_NAMES) names.clear();
    names.set(text, name);
  }
  return name;
}

/** Runs a statement as a prepared one on the given pool and returns its rows. */
export async function preparedRows<T extends QueryResultRow>(pool: Pool, text: string, values: unknown[]): Promise<T[]> {
  return (await pool.query<T>({ name: statementName(text), text, values })).rows;
}

/** The node-postgres pool under a TypeORM data source (reads that need no transaction go straight to it). */
export const poolOf = (ds: DataSource): Pool => (ds.driver as unknown as { master: Pool }).master;
