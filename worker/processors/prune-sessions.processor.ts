import type { DataSource } from 'typeorm';

/** Removes expired sign-in sessions; idempotent, so a repeat run is harmless. */
export async function pruneSessions(ds: DataSource): Promise<{ removed: number }> {
  const result = await ds.query(`DELETE FROM session WHERE expire < now()`);
  return { removed: Array.isArray(result) ? Number(result[1] ?? 0) : 0 };
}
