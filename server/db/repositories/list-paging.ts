import type { QueryResultRow } from 'pg';
import type { DataSource } from 'typeorm';
import type { createRowEstimates } from './row-estimates';
import { poolOf, preparedRows } from './prepared';

type RowEstimates = ReturnType<typeof createRowEstimates>;

// Keyset paging shared by the caseload, the message log and People. A sort is a list of key parts, each read in one
// direction, ending in the row's id so no two rows tie. A page is "the next N rows after this row" (or before it), which PostgreSQL reads by walking an
// index that matches the filter and the sort from the cursor, so the page costs the same deep in the list as at
// its start.

export type SortDir = 'ASC' | 'DESC';

/** Above this many matching rows a list's total is PostgreSQL's estimate, shown as "about N". */
export const EXACT_TOTAL_LIMIT = 10_000;

export interface KeyPart {
  /** The SQL expression sorted on (`r.send_at`). */
  expr: string;
  dir: SortDir;
  /** The type a cursor's text value is cast back to (`timestamptz`, `text`, `uuid`). */
  cast: string;
  /** The column of the select list holding this part's value as exact text (what a cursor carries). */
  text: string;
  /** The column of the select list holding the value itself, for ordering the union of a mixed-direction sort. */
  out: string;
}

export interface KeysetPosition {
  /** The page after (next) or before (prev) this row: its key values as text, the id last. */
  after?: string[];
  before?: string[];
  /** A page number typed in: rows skipped from the start (costs what it skips). */
  offset?: number;
}

const flip = (d: SortDir): SortDir => (d === 'ASC' ? 'DESC' : 'ASC');

/** A sort read the other way round ('-name' from 'name'). */
export const reversed = (key: KeyPart[]): KeyPart[] => key.map((p) => ({ ...p, dir: flip(p.dir) }));

/** The key values of a row as a cursor carries them (exact text, the id last). */
export const keyValues = (key: KeyPart[], row: Record<string, unknown>): string[] => key.map((p) => String(row[p.text]));

/** One page's SQL with :named parameters, and its order as an ORDER BY over the page's own columns (alias `page`). */
export interface PageSql { sql: string; params: Record<string, unknown>; order: string }

/**
 * The SQL of one page: `select` is "SELECT … FROM … [JOIN …]" (the columns named by each part's `text` and `out`
 * included), `where` the filters with :named parameters. Reads `limit` rows. Backwards (a page before a row) reads
 * the same index the other way; the caller turns those rows round.
 *
 * A sort whose parts all run one way is one row comparison, `(a, b, id) > (…)`, which PostgreSQL uses as the start
 * of an index scan. A sort that changes direction part-way (status A→Z, then newest first) cannot be one row
 * comparison; it is split into one branch per run of same-direction parts (the same status and later in time; or a
 * later status), each an index walk of its own, joined with UNION ALL and cut to the page.
 */
export function keysetPageSql(opts: {
  select: string; where: string[]; params: Record<string, unknown>; key: KeyPart[]; at: KeysetPosition; limit: number;
}): PageSql {
  const backwards = !!opts.at.before;
  const key = backwards ? reversed(opts.key) : opts.key;
  const order = key.map((p) => `CAST(page.${p.text} AS ${p.cast}) ${p.dir}`).join(', ');
  const from = opts.at.after ?? opts.at.before;
  const params: Record<string, unknown> = { ...opts.params, k_limit: opts.limit };
  const orderBy = (parts: KeyPart[], col: (p: KeyPart) => string) => parts.map((p) => `${col(p)} ${p.dir}`).join(', ');
  const where = (extra: string[]) => {
    const all = [...opts.where, ...extra];
    return all.length ? ` WHERE ${all.join(' AND ')}` : '';
  };
  if (!from) {
    params.k_offset = opts.at.offset ?? 0;
    return { sql: `${opts.select}${where([])} ORDER BY ${orderBy(key, (p) => p.expr)} LIMIT :k_limit OFFSET :k_offset`, params, order };
  }
  const value = (n: number) => {
    params[`k_${n}`] = from[n];
    return `CAST(:k_${n} AS ${key[n]!.cast})`;
  };
  // Runs of parts read in the same direction: [[status ASC], [send_at DESC, id DESC]].
  const runs: number[][] = [];
  key.forEach((p, n) => (n > 0 && p.dir === key[n - 1]!.dir ? runs.at(-1)!.push(n) : runs.push([n])));
  const branches = runs.map((run, r) => {
    const equal = runs.slice(0, r).flat().map((n) => `${key[n]!.expr} = ${value(n)}`);
    const cols = run.map((n) => key[n]!.expr);
    const op = key[run[0]!]!.dir === 'ASC' ? '>' : '<';
    const beyond = `(${cols.join(', ')}) ${op} (${run.map(value).join(', ')})`;
    return `${opts.select}${where([...equal, beyond])} ORDER BY ${orderBy(key, (p) => p.expr)} LIMIT :k_limit`;
  });
  if (branches.length === 1) return { sql: branches[0]!, params, order };
  return { sql: `SELECT * FROM (${branches.map((b) => `(${b})`).join(' UNION ALL ')}) page ORDER BY ${orderBy(key, (p) => p.out)} LIMIT :k_limit`, params, order };
}

/**
 * One page and how many rows match, read in one statement (one round trip, one connection). The count is exact up
 * to EXACT_TOTAL_LIMIT (counting stops there, so it reads at most that many index entries) and PostgreSQL's row
 * estimate above it (shown as "about N", remembered for a while by `estimateRows`, see row-estimates.ts). The count
 * is a row of its own and the page is joined to it, so a page past the end still brings its count.
 * `count.sql` is "SELECT 1 FROM … WHERE …" with :named parameters of the same names and values as the page's.
 * The page's rows come back in its order (`order`, on the page's exact-text key columns cast back), each with a
 * `k_total` column the caller ignores. `prepared`: as prepared.ts, only for a page that names its columns.
 */
export async function pageAndCount<T extends QueryResultRow & { id: string }>(
  ds: DataSource, estimateRows: RowEstimates, page: PageSql, count: { sql: string; params: Record<string, unknown> }, prepared: boolean,
): Promise<{ rows: T[]; total: number; estimate: boolean }> {
  const [sql, params] = ds.driver.escapeQueryWithParameters(
    `SELECT c.k_total, page.* FROM (SELECT count(*)::int AS k_total FROM (${count.sql} LIMIT ${EXACT_TOTAL_LIMIT + 1}) capped) c
      LEFT JOIN (${page.sql}) page ON true ORDER BY ${page.order}`,
    { ...count.params, ...page.params });
  const read: Array<T & { k_total: number }> = prepared ? await preparedRows(poolOf(ds), sql, params) : await ds.query(sql, params);
  const n = read[0]!.k_total;
  // An empty page is the count's row alone, its page columns null.
  const rows = read[0]!.id === null ? [] : read;
  if (n <= EXACT_TOTAL_LIMIT) return { rows, total: n, estimate: false };
  const [countSql, countParams] = ds.driver.escapeQueryWithParameters(count.sql, count.params);
  return { rows, total: Math.max(EXACT_TOTAL_LIMIT + 1, await estimateRows(countSql, countParams)), estimate: true };
}

/** A search text as a LIKE/ILIKE pattern matching it anywhere, LIKE's own wildcards in it taken literally. */
export const containsPattern = (text: string): string => `%${text.replace(/[\\%_]/g, '\\$&')}%`;

/** A page read with one row more than asked for: the page, and whether more rows follow in the reading direction. */
export function cutPage<T>(rows: T[], pageSize: number, at: KeysetPosition): { rows: T[]; more: boolean } {
  const page = rows.slice(0, pageSize);
  return { rows: at.before ? page.reverse() : page, more: rows.length > pageSize };
}
