import { ValidationError } from './errors';

// A list cursor: the sort it belongs to, the sort key's values of one row (exact text) and that row's id, as
// base64url JSON. It is a position, not a secret: a forged one only moves the page, and the caller's ability still
// filters every row in SQL.
export interface Cursor { sort: string; values: string[]; id: string }

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const encodeCursor = (c: Cursor): string => Buffer.from(JSON.stringify([c.sort, c.values, c.id])).toString('base64url');

const bad = () => new ValidationError({ 'query.cursor': ['This page link is out of date or damaged; go back to the first page.'] });

export function decodeCursor(text: string, sort: string, keyCount: number): Cursor {
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
  } catch {
    throw bad();
  }
  if (!Array.isArray(parsed) || parsed.length !== 3) throw bad();
  const [s, values, id] = parsed as [unknown, unknown, unknown];
  if (s !== sort || typeof id !== 'string' || !UUID.test(id)) throw bad();
  if (!Array.isArray(values) || values.length !== keyCount || !values.every((v) => typeof v === 'string' && v.length <= 200)) throw bad();
  return { sort, values: values as string[], id };
}

/** Where a list request starts: after or before the cursor's row, or at the page number's offset. */
export function positionOf(query: { cursor?: string; direction: 'next' | 'prev'; page: number; pageSize: number }, sort: string, keyCount: number) {
  const from = query.cursor ? decodeCursor(query.cursor, sort, keyCount) : undefined;
  if (!from) return { from, at: { offset: (query.page - 1) * query.pageSize } };
  const values = [...from.values, from.id];
  return { from, at: query.direction === 'prev' ? { before: values } : { after: values } };
}

/**
 * The cursors of the pages beside one just read. `more` says whether rows follow in the reading direction; going
 * back, that means pages before this one, and a page reached by "previous" always has one after it.
 */
export function pageCursors<R>(opts: {
  query: { direction: 'next' | 'prev'; page: number }; from: Cursor | undefined; rows: R[]; more: boolean; cursorOf: (row: R) => string;
}): { nextCursor: string | null; prevCursor: string | null } {
  const { query, from, rows, more, cursorOf } = opts;
  const back = query.direction === 'prev' && !!from;
  const hasNext = back ? true : more;
  const hasPrev = back ? more : !!from || query.page > 1;
  const first = rows[0];
  const last = rows.at(-1);
  return { nextCursor: hasNext && last ? cursorOf(last) : null, prevCursor: hasPrev && first ? cursorOf(first) : null };
}

/**
 * Reads a page whose cursor came from the client. A forged cursor value that PostgreSQL cannot read as its key's
 * type (a date that is no date: SQLSTATE class 22, data exception) is the same 400 as a damaged cursor, not a 500;
 * every other parameter of a list query is checked by its schema before it gets here.
 */
export async function readingFrom<T>(from: Cursor | undefined, read: Promise<T>): Promise<T> {
  try {
    return await read;
  } catch (error) {
    const code = (error as { code?: unknown }).code;
    if (from && typeof code === 'string' && code.startsWith('22')) throw bad();
    throw error;
  }
}
