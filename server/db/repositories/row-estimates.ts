import type { DataSource } from 'typeorm';

/** How long one planner estimate is reused: the figure is shown as "about N", so a few seconds' drift is harmless. */
export const ESTIMATE_TTL_MS = 30_000;
const KEPT = 1_000;

/**
 * PostgreSQL's own estimate of how many rows a query returns (EXPLAIN, nothing run), remembered per query and
 * parameters for ESTIMATE_TTL_MS so a list above the exact-count limit costs no extra statement on most requests.
 */
export function createRowEstimates(ds: DataSource, now: () => number = Date.now) {
  const remembered = new Map<string, { rows: number; at: number }>();
  return async function estimateRows(sql: string, params: unknown[]): Promise<number> {
    const key = JSON.stringify([sql, params]);
    const hit = remembered.get(key);
    if (hit && now() - hit.at < ESTIMATE_TTL_MS) return hit.rows;
    const [{ 'QUERY PLAN': plan }] = await ds.query(`EXPLAIN (FORMAT JSON) ${sql}`, params);
    const rows = Math.round(Number(plan?.[0]?.Plan?.['Plan Rows'] ?? 0));
    if (remembered.size >= KEPT) remembered.clear();
    remembered.set(key, { rows, at: now() });
    return rows;
  };
}
