import type { DataSource, EntityManager, SelectQueryBuilder } from 'typeorm';
import type { ListInfantsQuery } from '@shared/schemas/infants';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { InfantEntity } from '../entities/infant.entity';
import { createRowEstimates } from './row-estimates';

export const INFANT_ACL_COLUMNS = { programmeId: 'i.programme_id', nurseId: 'i.nurse_id', id: 'i.id' };

// Corrected age grows as the term-equivalent date gets earlier; elevation grows as pressure falls. Each sort is a
// key read in one direction with the id last to break ties, so a page is "the next N after this row" and PostgreSQL
// walks the matching index (migration ListIndexes) from the cursor instead of counting past every earlier row.
export const SORT_KEYS: Record<string, { cols: string[]; dir: 'ASC' | 'DESC' }> = {
  name: { cols: ['i.family_name', 'i.given_name'], dir: 'ASC' },
  correctedAge: { cols: ['i.term_date'], dir: 'DESC' },
  elevation: { cols: ['i.home_pressure_mmhg'], dir: 'DESC' },
  status: { cols: ['i.status'], dir: 'ASC' },
  enrolled: { cols: ['i.created_at'], dir: 'ASC' },
};
// How each key is read back from a row (as exact text) and compared again (cast back from text).
const KEY_TEXT: Record<string, { alias: string; cast: string }> = {
  'i.family_name': { alias: 'family_name', cast: 'text' },
  'i.given_name': { alias: 'given_name', cast: 'text' },
  'i.term_date': { alias: 'k_term_date', cast: 'date' },
  'i.home_pressure_mmhg': { alias: 'k_pressure', cast: 'numeric' },
  'i.status': { alias: 'status', cast: 'text' },
  'i.created_at': { alias: 'k_created_at', cast: 'timestamptz' },
};

/** Above this many matching babies the total is PostgreSQL's estimate, shown as "about N". */
export const EXACT_TOTAL_LIMIT = 10_000;

export interface ListPosition { after?: { values: string[]; id: string }; before?: { values: string[]; id: string }; offset?: number }

export interface InfantListRow {
  id: string; given_name: string; family_name: string; birth_date: string; ga_weeks: number; ga_days: number;
  home_elevation_m: string | null; home_pressure_mmhg: string; status: string; flags: string[];
  nurse_id: string | null; nurse_name: string | null; consultant_id: string | null; consultant_name: string | null;
  active_flow_lpm: string | null; k_term_date: string; k_pressure: string; k_created_at: string;
}

/** The values of a row's sort key, in key order, as exact text (what a cursor carries). */
export function sortValues(sort: string, row: InfantListRow): string[] {
  return SORT_KEYS[sort.replace('-', '')]!.cols.map((c) => String(row[KEY_TEXT[c]!.alias as keyof InfantListRow]));
}

function filtered<T extends object>(qb: SelectQueryBuilder<T>, query: ListInfantsQuery, acl: SqlFilter, extra?: SqlFilter) {
  qb.where(acl.sql, acl.params);
  if (extra) qb.andWhere(extra.sql, extra.params);
  if (query.status) qb.andWhere('i.status = :status', { status: query.status });
  if (query.flag) qb.andWhere(':flag = ANY(i.flags)', { flag: query.flag });
  if (query.q) {
    const q = `%${query.q.replace(/[%_\\]/g, '\\$&')}%`;
    qb.andWhere("(i.given_name || ' ' || i.family_name ILIKE :q OR i.family_name ILIKE :q)", { q });
  }
  return qb;
}

function withPeople<T extends object>(qb: SelectQueryBuilder<T>) {
  return qb
    .leftJoin('users', 'n', 'n.id = i.nurse_id')
    .leftJoin('users', 'c', 'c.id = i.consultant_id')
    .leftJoin('prescriptions', 'p', "p.infant_id = i.id AND p.status = 'active'")
    .addSelect(['n.name AS nurse_name', 'c.name AS consultant_name', 'p.approved_flow_lpm AS active_flow_lpm']);
}

export function createInfantsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(InfantEntity);
  const estimateRows = createRowEstimates(ds);
  return {
    /** The baby's given and family name as one text, or undefined when there is no such baby. */
    fullName: async (id: string): Promise<{ name: string } | undefined> =>
      (await ds.query(`SELECT given_name || ' ' || family_name AS name FROM infants WHERE id = $1`, [id]))[0],

    /** Drops the 'number_unreadable' flag from a baby whose numbers were all just saved in a readable form. */
    clearUnreadableNumberFlag: (id: string, m: EntityManager): Promise<unknown> =>
      m.query(`UPDATE infants SET flags = array_remove(flags, 'number_unreadable') WHERE id = $1 AND 'number_unreadable' = ANY(flags)`, [id]),

    /** Drops the 'number_unreadable' flag from each of these babies whose contacts' mobiles are now all in E.164 form. */
    clearUnreadableNumberFlagWhereAllReadable: (ids: string[], m: EntityManager): Promise<unknown> =>
      m.query(
        `UPDATE infants i SET flags = array_remove(i.flags, 'number_unreadable')
          WHERE i.id = ANY($1::uuid[]) AND 'number_unreadable' = ANY(i.flags)
            AND NOT EXISTS (SELECT 1 FROM family_contacts c WHERE c.infant_id = i.id AND c.mobile IS NOT NULL AND c.mobile !~ '^\\+[1-9][0-9]{6,14}$')`,
        [ids]),

    /**
     * One page in the sort's order: the first, the one after a row (next), the one before a row (previous), or at
     * an offset (a page number typed in). Reads one row more than the page to know whether more follow.
     */
    async list(query: ListInfantsQuery, acl: SqlFilter, extra: SqlFilter | undefined, at: ListPosition): Promise<{ rows: InfantListRow[]; more: boolean }> {
      const qb = filtered(withPeople(
        ds.createQueryBuilder().select(['i.id AS id', 'i.given_name AS given_name', 'i.family_name AS family_name',
          'i.birth_date::text AS birth_date', 'i.ga_weeks AS ga_weeks', 'i.ga_days AS ga_days', 'i.home_elevation_m AS home_elevation_m',
          'i.home_pressure_mmhg AS home_pressure_mmhg', 'i.status AS status', 'i.flags AS flags', 'i.nurse_id AS nurse_id',
          'i.consultant_id AS consultant_id', 'i.term_date::text AS k_term_date', 'i.home_pressure_mmhg::text AS k_pressure',
          'i.created_at::text AS k_created_at']).from('infants', 'i'),
      ), query, acl, extra);
      const key = SORT_KEYS[query.sort.replace('-', '')]!;
      const flipped = query.sort.startsWith('-');
      const forward = flipped ? (key.dir === 'ASC' ? 'DESC' : 'ASC') : key.dir;
      // Reading backwards (the page before a row) walks the same index the other way, then the page is turned round.
      const backwards = !!at.before;
      const dir = backwards ? (forward === 'ASC' ? 'DESC' : 'ASC') : forward;
      const from = at.after ?? at.before;
      if (from) {
        const cols = [...key.cols, 'i.id'];
        const params: Record<string, string> = { k_id: from.id };
        const vals = key.cols.map((c, n) => {
          params[`k_${n}`] = from.values[n]!;
          return `CAST(:k_${n} AS ${KEY_TEXT[c]!.cast})`;
        });
        qb.andWhere(`(${cols.join(', ')}) ${dir === 'ASC' ? '>' : '<'} (${[...vals, 'CAST(:k_id AS uuid)'].join(', ')})`, params);
      }
      for (const col of key.cols) qb.addOrderBy(col, dir);
      qb.addOrderBy('i.id', dir).limit(query.pageSize + 1);
      if (!from && at.offset) qb.offset(at.offset);
      const rows: InfantListRow[] = await qb.getRawMany();
      const more = rows.length > query.pageSize;
      const page = rows.slice(0, query.pageSize);
      return { rows: backwards ? page.reverse() : page, more };
    },

    /**
     * How many babies match: exact up to EXACT_TOTAL_LIMIT (counting stops there, so it costs at most that many
     * index entries), PostgreSQL's row estimate above it.
     */
    async count(query: ListInfantsQuery, acl: SqlFilter, extra?: SqlFilter): Promise<{ total: number; estimate: boolean }> {
      const qb = filtered(ds.createQueryBuilder().select('1').from('infants', 'i'), query, acl, extra).limit(EXACT_TOTAL_LIMIT + 1);
      const [sql, params] = qb.getQueryAndParameters();
      const [{ n }] = await ds.query(`SELECT count(*)::int AS n FROM (${sql}) capped`, params);
      if (n <= EXACT_TOTAL_LIMIT) return { total: n, estimate: false };
      const [unlimitedSql, unlimitedParams] = filtered(ds.createQueryBuilder().select('1').from('infants', 'i'), query, acl, extra).getQueryAndParameters();
      const rows = await estimateRows(unlimitedSql, unlimitedParams);
      return { total: Math.max(EXACT_TOTAL_LIMIT + 1, rows), estimate: true };
    },

    findVisible: (id: string, acl: SqlFilter, m?: EntityManager) =>
      repo(m).createQueryBuilder('i').where('i.id = :id', { id }).andWhere(acl.sql, acl.params).getOne(),

    /** Locks the row for a read-modify-write in the caller's transaction. */
    findForUpdate: (id: string, m: EntityManager) =>
      repo(m).createQueryBuilder('i').setLock('pessimistic_write').where('i.id = :id', { id }).getOne(),

    findByEnrolKey: (programmeId: string, enrolKey: string, m?: EntityManager) => repo(m).findOne({ where: { programmeId, enrolKey } }),
    insert: (data: Partial<InfantEntity>, m: EntityManager) => repo(m).save(repo(m).create(data)),
    save: (infant: InfantEntity, m: EntityManager) => repo(m).save(infant),
    peopleNames: async (ids: Array<string | null>): Promise<Map<string, string>> => {
      const wanted = ids.filter((x): x is string => !!x);
      if (!wanted.length) return new Map();
      const rows: Array<{ id: string; name: string }> = await ds.query(`SELECT id, name FROM users WHERE id = ANY($1)`, [wanted]);
      return new Map(rows.map((r) => [r.id, r.name]));
    },
  };
}
export type InfantsRepository = ReturnType<typeof createInfantsRepository>;
