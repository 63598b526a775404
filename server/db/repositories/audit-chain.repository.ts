import type { DataSource } from 'typeorm';

/** Rows without a programme (a sign-in attempt for an unknown address) form their own chain under this id. */
export const NO_PROGRAMME_CHAIN = '00000000-0000-0000-0000-000000000000';

export interface ChainHead { chainId: string; lastSeq: number; lastHash: string; lastId: string | null }

export interface ChainRow {
  id: string;
  at: Date;
  seq: number;
  prevHash: string;
  rowHash: string;
  /** The hash of the row's content as it is now, computed by the same database function the insert trigger used. */
  computedHash: string;
}

export interface ChainCheckRecord {
  chainId: string;
  checkedAt: Date;
  checkedBy: string | null;
  ok: boolean;
  rowsChecked: number;
  lastSeq: number;
  brokenRowId: string | null;
  brokenRowAt: Date | null;
  brokenSeq: number | null;
  problem: string | null;
}

const headOf = (r: Record<string, unknown>): ChainHead => ({
  chainId: r.chain_id as string, lastSeq: Number(r.last_seq), lastHash: r.last_hash as string, lastId: (r.last_id as string | null) ?? null,
});

export function createAuditChainRepository(ds: DataSource) {
  return {
    async heads(): Promise<ChainHead[]> {
      const rows: Array<Record<string, unknown>> = await ds.query(`SELECT chain_id, last_seq, last_hash, last_id::text AS last_id FROM audit_chain_heads ORDER BY chain_id`);
      return rows.map(headOf);
    },
    async head(chainId: string): Promise<ChainHead | null> {
      const rows: Array<Record<string, unknown>> = await ds.query(
        `SELECT chain_id, last_seq, last_hash, last_id::text AS last_id FROM audit_chain_heads WHERE chain_id = $1`, [chainId]);
      return rows[0] ? headOf(rows[0]) : null;
    },
    /** One batch of a chain in order, from just after `afterSeq` up to `uptoSeq`. */
    async rows(chainId: string, afterSeq: number, uptoSeq: number, limit: number): Promise<ChainRow[]> {
      const rows: Array<Record<string, unknown>> = await ds.query(
        `SELECT e.id::text AS id, e.at, e.chain_seq, e.prev_hash, e.row_hash, audit_event_hash(e) AS computed
         FROM audit_events e
         WHERE coalesce(e.programme_id, '${NO_PROGRAMME_CHAIN}'::uuid) = $1 AND e.chain_seq > $2 AND e.chain_seq <= $3
         ORDER BY e.chain_seq LIMIT $4`,
        [chainId, afterSeq, uptoSeq, limit],
      );
      return rows.map((r) => ({
        id: r.id as string, at: r.at as Date, seq: Number(r.chain_seq), prevHash: r.prev_hash as string,
        rowHash: r.row_hash as string, computedHash: r.computed as string,
      }));
    },
    /** Who is told when a chain breaks: the programme's active admins (every active admin for the shared chain). */
    activeAdmins: (chainId: string): Promise<Array<{ id: string; name: string; email: string }>> =>
      ds.query(
        `SELECT id, name, email FROM users WHERE role = 'admin' AND NOT disabled AND ($1::uuid = '${NO_PROGRAMME_CHAIN}'::uuid OR programme_id = $1) ORDER BY id`,
        [chainId],
      ),
    async record(c: ChainCheckRecord): Promise<string> {
      const rows: Array<{ id: string }> = await ds.query(
        `INSERT INTO audit_chain_checks (chain_id, checked_at, checked_by, ok, rows_checked, last_seq, broken_row_id, broken_row_at, broken_seq, problem)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10) RETURNING id::text AS id`,
        [c.chainId, c.checkedAt, c.checkedBy, c.ok, c.rowsChecked, c.lastSeq, c.brokenRowId, c.brokenRowAt, c.brokenSeq, c.problem],
      );
      return rows[0]!.id;
    },
    /** The latest checks of one chain, newest first, with the checker's name. */
    async latest(chainId: string, limit: number): Promise<Array<ChainCheckRecord & { id: string; checkedByName: string | null }>> {
      const rows: Array<Record<string, unknown>> = await ds.query(
        `SELECT c.*, c.id::text AS id_text, c.broken_row_id::text AS broken_row_text, u.name AS checker
         FROM audit_chain_checks c LEFT JOIN users u ON u.id = c.checked_by
         WHERE c.chain_id = $1 ORDER BY c.checked_at DESC, c.id DESC LIMIT $2`,
        [chainId, limit],
      );
      return rows.map((r) => ({
        id: r.id_text as string, chainId: r.chain_id as string, checkedAt: r.checked_at as Date, checkedBy: r.checked_by as string | null,
        checkedByName: r.checker as string | null, ok: r.ok as boolean, rowsChecked: Number(r.rows_checked), lastSeq: Number(r.last_seq),
        brokenRowId: r.broken_row_text as string | null, brokenRowAt: r.broken_row_at as Date | null,
        brokenSeq: r.broken_seq == null ? null : Number(r.broken_seq), problem: r.problem as string | null,
      }));
    },
  };
}
export type AuditChainRepository = ReturnType<typeof createAuditChainRepository>;
