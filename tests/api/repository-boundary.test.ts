import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// DEVELOPERS.md, "Router → service → repository": only server/db/repositories touches TypeORM and SQL.
const ROOT = path.resolve(__dirname, '../..');
const SCANNED = ['server/modules', 'server/jobs', 'worker'];

/**
 * Files that may still run SQL themselves, each with its reason. An entry whose file no longer does is an error
 * too, so the list only shrinks.
 */
const ALLOWED: Record<string, string> = {
  // The readiness probe's `SELECT 1` checks the connection itself; there is no data to put behind a repository.
  'server/modules/health/health.router.ts': 'readiness ping',
};

/** A raw query on a DataSource / EntityManager (`ds.query(`, `m.query<…>(`) or a query builder. */
const RAW_SQL = /\.query\s*(<[^>]*>)?\s*\(|\bcreateQueryBuilder\s*\(/;

function sourceFiles(dir: string): string[] {
  return readdirSync(path.join(ROOT, dir), { withFileTypes: true }).flatMap((e) => {
    const rel = `${dir}/${e.name}`;
    if (e.isDirectory()) return sourceFiles(rel);
    return /\.tsx?$/.test(e.name) ? [rel] : [];
  });
}

const offenders = (files: string[]) => files.filter((f) => RAW_SQL.test(readFileSync(path.join(ROOT, f), 'utf8')));

describe('repository boundary', () => {
  const files = SCANNED.flatMap(sourceFiles);

  it('recognises the raw query forms it looks for', () => {
    expect(RAW_SQL.test('await m.query(`SELECT 1`)')).toBe(true);
    expect(RAW_SQL.test('await ds.query<Row[]>(sql)')).toBe(true);
    expect(RAW_SQL.test("m.getRepository(X).createQueryBuilder('x')")).toBe(true);
    expect(RAW_SQL.test('repos.reminders.update(id, set, m)')).toBe(false);
    expect(RAW_SQL.test('req.query.page')).toBe(false);
  });

  it('scans the modules, jobs and worker', () => {
    expect(files.length).toBeGreaterThan(20);
    expect(files).toContain('server/modules/reminders/delivery.ts');
  });

  it('when a file outside server/db/repositories runs SQL itself, then it is named here (move it into a repository)', () => {
    expect(offenders(files).filter((f) => !(f in ALLOWED))).toEqual([]);
  });

  it('when an allowed file no longer runs SQL itself, then its allow-list entry goes too', () => {
    expect(Object.keys(ALLOWED).filter((f) => !offenders([f]).length)).toEqual([]);
  });
});
