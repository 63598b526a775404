import type { AuditChainRepository, ChainHead } from '../../db/repositories/audit-chain.repository';

/** The hash a chain starts from (the migration's genesis value). */
export const GENESIS_HASH = '0'.repeat(64);

export interface BrokenLink {
  /** The first row that does not fit; null when the newest rows are missing altogether. */
  rowId: string | null;
  rowAt: Date | null;
  seq: number;
  problem: string;
}

export interface ChainResult {
  chainId: string;
  ok: boolean;
  rowsChecked: number;
  lastSeq: number;
  broken: BrokenLink | null;
}

/**
 * Walks one chain in order and stops at the first row that does not fit. The head is read first: rows written while
 * the walk runs lie beyond it and wait for the next check. Per row, in this order: its place (a gap means rows were
 * removed before it), its own hash against its content as stored now (the row was changed), and its link to the
 * row before (a row before it was changed and re-hashed, or one was put in). Finally the head must match the
 * last row (the newest rows were removed).
 */
export async function verifyChain(repo: AuditChainRepository, chainId: string, batch = 2000): Promise<ChainResult> {
  const head: ChainHead | null = await repo.head(chainId);
  const result = (rowsChecked: number, lastSeq: number, broken: BrokenLink | null): ChainResult =>
    ({ chainId, ok: broken === null, rowsChecked, lastSeq, broken });
  if (!head) return result(0, 0, null);
  let prevSeq = 0;
  let prevHash = GENESIS_HASH;
  let count = 0;
  for (;;) {
    const rows = await repo.rows(chainId, prevSeq, head.lastSeq, batch);
    for (const row of rows) {
      const at = { rowId: row.id, rowAt: row.at, seq: row.seq };
      if (row.seq !== prevSeq + 1) {
        const missing = row.seq - prevSeq - 1;
        return result(count, head.lastSeq, { ...at, problem: `${missing === 1 ? `Row ${prevSeq + 1} of the chain is` : `Rows ${prevSeq + 1} to ${row.seq - 1} of the chain are`} missing just before this one (removed).` });
      }
      if (row.computedHash !== row.rowHash) {
        return result(count, head.lastSeq, { ...at, problem: 'This row was changed after it was written: its content no longer matches its stored hash.' });
      }
      if (row.prevHash !== prevHash) {
        return result(count, head.lastSeq, { ...at, problem: 'This row no longer follows the row before it: its stored link does not match that row\'s hash (a row before it was changed and re-hashed, or put in).' });
      }
      prevSeq = row.seq;
      prevHash = row.rowHash;
      count += 1;
    }
    if (rows.length < batch) break;
  }
  if (prevSeq !== head.lastSeq) {
    return result(count, head.lastSeq, { rowId: head.lastId, rowAt: null, seq: prevSeq + 1,
      problem: `The newest rows of the chain (${prevSeq + 1} to ${head.lastSeq}) are missing (removed).` });
  }
  if (prevHash !== head.lastHash) {
    return result(count, head.lastSeq, { rowId: head.lastId, rowAt: null, seq: head.lastSeq, problem: 'The newest row does not match the hash recorded for the end of the chain.' });
  }
  return result(count, head.lastSeq, null);
}
