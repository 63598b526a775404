import type { DataSource, EntityManager } from 'typeorm';
import type { QueryResultRow } from 'pg';
import type { ListInfantsQuery } from '@shared/schemas/infants';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { FamilyContactEntity } from '../entities/family-contact.entity';
import { InfantEntity } from '../entities/infant.entity';
import { PrescriptionEntity } from '../entities/prescription.entity';
import { SiteEntity } from '../entities/site.entity';
import { UserEntity } from '../entities/user.entity';
import { createRowEstimates } from './row-estimates';
import { containsPattern, cutPage, keysetPageSql, keyValues, pageAndCount, reversed, type KeyPart, type KeysetPosition, type SortDir } from './list-paging';
import { poolOf, preparedRows } from './prepared';

export const INFANT_ACL_COLUMNS = { programmeId: 'i.programme_id', nurseId: 'i.nurse_id', id: 'i.id' };

/**
 * A baby's full name as the name searches match it (the caseload's and the message log's): exactly the expression
 * infants_full_name_trgm_idx indexes (migration InfantNameSearchIndex), so change both together.
 */
export const fullNameSql = (alias: string): string => `(${alias}.given_name || ' ' || ${alias}.family_name)`;

// Corrected age grows as the term-equivalent date gets earlier; elevation grows as pressure falls. Each sort is a
// key read in one direction with the id last to break ties, so a page is "the next N after this row" and PostgreSQL
// walks the matching index (migration ListIndexes) from the cursor instead of counting past every earlier row
// (list-paging.ts). `text` is the select-list column holding the part's value as exact text (what a cursor carries).
const part = (expr: string, dir: SortDir, cast: string, text: string): KeyPart => ({ expr, dir, cast, text, out: text });
const ID_ASC = part('i.id', 'ASC', 'uuid', 'id');
const ID_DESC = part('i.id', 'DESC', 'uuid', 'id');
const NATURAL: Record<string, KeyPart[]> = {
  name: [part('i.family_name', 'ASC', 'text', 'family_name'), part('i.given_name', 'ASC', 'text', 'given_name'), ID_ASC],
  correctedAge: [part('i.term_date', 'DESC', 'date', 'k_term_date'), ID_DESC],
  elevation: [part('i.home_pressure_mmhg', 'DESC', 'numeric', 'k_pressure'), ID_DESC],
  status: [part('i.status', 'ASC', 'text', 'status'), ID_ASC],
  enrolled: [part('i.created_at', 'ASC', 'timestamptz', 'k_created_at'), ID_ASC],
};

/** The key a sort reads, in reading order ('-elevation' is the natural key reversed), the id last. */
export function sortKey(sort: string): KeyPart[] {
  const natural = NATURAL[sort.replace('-', '')]!;
  return sort.startsWith('-') ? reversed(natural) : natural;
}

/** How many key values (before the id) a sort's cursor carries. */
export const sortKeyLength = (sort: string): number => NATURAL[sort.replace('-', '')]!.length - 1;

export { EXACT_TOTAL_LIMIT } from './list-paging';

export interface InfantListRow {
  id: string; given_name: string; family_name: string; birth_date: string; ga_weeks: number; ga_days: number;
  home_elevation_m: string | null; home_pressure_mmhg: string; status: string; flags: string[];
  nurse_id: string | null; nurse_name: string | null; consultant_id: string | null; consultant_name: string | null;
  active_flow_lpm: string | null; k_term_date: string; k_pressure: string; k_created_at: string;
}

/** The values of a row's sort key, in key order, as exact text (what a cursor carries), the id left out. */
export function sortValues(sort: string, row: InfantListRow): string[] {
  return keyValues(sortKey(sort), row as unknown as Record<string, unknown>).slice(0, -1);
}

const LIST_SELECT = `SELECT i.id, i.given_name, i.family_name, i.birth_date::text AS birth_date, i.ga_weeks, i.ga_days, i.home_elevation_m,
    i.home_pressure_mmhg, i.status, i.flags, i.nurse_id, i.consultant_id, i.term_date::text AS k_term_date,
    i.home_pressure_mmhg::text AS k_pressure, i.created_at::text AS k_created_at,
    n.name AS nurse_name, c.name AS consultant_name, p.approved_flow_lpm AS active_flow_lpm
  FROM infants i LEFT JOIN users n ON n.id = i.nurse_id LEFT JOIN users c ON c.id = i.consultant_id
    LEFT JOIN prescriptions p ON p.infant_id = i.id AND p.status = 'active'`;

/** One caseload page's SQL (list-paging.ts) and the filters it reads, for the page alone or with its count. */
function caseloadPage(query: ListInfantsQuery, acl: SqlFilter, extra: SqlFilter | undefined, at: KeysetPosition) {
  const { where, named } = listFilter(query, acl, extra);
  return { where, named, page: keysetPageSql({ select: LIST_SELECT, where, params: named, key: sortKey(query.sort), at, limit: query.pageSize + 1 }) };
}

/** The list's filters as SQL conditions with :named parameters (the caller's rights first). */
function listFilter(query: ListInfantsQuery, acl: SqlFilter, extra?: SqlFilter): { where: string[]; named: Record<string, unknown> } {
  const where = [`(${acl.sql})`];
  const named: Record<string, unknown> = { ...acl.params };
  if (extra) {
    where.push(`(${extra.sql})`);
    Object.assign(named, extra.params);
  }
  if (query.status) {
    where.push('i.status = :status');
    named.status = query.status;
  }
  if (query.flag) {
    where.push(':flag = ANY(i.flags)');
    named.flag = query.flag;
  }
  if (query.q) {
    // A match in the family name is a match in the full name too.
    where.push(`${fullNameSql('i')} ILIKE :q`);
    named.q = containsPattern(query.q);
  }
  return { where, named };
}

export function createInfantsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(InfantEntity);
  const estimateRows = createRowEstimates(ds);
  const pool = poolOf(ds);
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
     * an offset (a page number typed in). Reads one row more than the page to know whether more follow. Prepared
     * (prepared.ts): the page is read on every turn of the caseload.
     */
    async list(query: ListInfantsQuery, acl: SqlFilter, extra: SqlFilter | undefined, at: KeysetPosition): Promise<{ rows: InfantListRow[]; more: boolean }> {
      const { page } = caseloadPage(query, acl, extra, at);
      const [sql, params] = ds.driver.escapeQueryWithParameters(page.sql, page.params);
      return cutPage(await preparedRows<InfantListRow & QueryResultRow>(pool, sql, params), query.pageSize, at);
    },

    /**
     * A page of the caseload (as `list`) and how many babies match, in one prepared statement (list-paging.ts):
     * exact up to EXACT_TOTAL_LIMIT (counting stops there, so it costs at most that many index entries),
     * PostgreSQL's row estimate above it.
     */
    async listWithTotal(query: ListInfantsQuery, acl: SqlFilter, extra: SqlFilter | undefined, at: KeysetPosition): Promise<{ rows: InfantListRow[]; more: boolean; total: number; estimate: boolean }> {
      const { where, named, page } = caseloadPage(query, acl, extra, at);
      const { rows, total, estimate } = await pageAndCount<InfantListRow & QueryResultRow>(ds, estimateRows, page, { sql: `SELECT 1 FROM infants i WHERE ${where.join(' AND ')}`, params: named }, true);
      return { ...cutPage(rows, query.pageSize, at), total, estimate };
    },

    /**
     * A baby's record in one statement, when the caller may read the baby: the baby, its hospital site, its family
     * contacts in order, its active setting (null without one) and the names of its nurse and consultant.
     */
    async findRecord(id: string, acl: SqlFilter): Promise<InfantRecord | undefined> {
      type Mapped = InfantEntity & { site?: SiteEntity | null; contacts?: FamilyContactEntity[]; active?: PrescriptionEntity | null };
      const { entities, raw } = await repo().createQueryBuilder('i')
        .leftJoinAndMapOne('i.site', SiteEntity, 's', 's.id = i.site_id AND s.programme_id = i.programme_id')
        .leftJoinAndMapMany('i.contacts', FamilyContactEntity, 'fc', 'fc.infant_id = i.id')
        .leftJoinAndMapOne('i.active', PrescriptionEntity, 'p', "p.infant_id = i.id AND p.status = 'active'")
        .leftJoin(UserEntity, 'n', 'n.id = i.nurse_id').addSelect('n.name', 'nurse_name')
        .leftJoin(UserEntity, 'c', 'c.id = i.consultant_id').addSelect('c.name', 'consultant_name')
        .where('i.id = :id', { id }).andWhere(acl.sql, acl.params)
        .orderBy('fc.position', 'ASC')
        .getRawAndEntities();
      const found = entities[0] as Mapped | undefined;
      if (!found) return undefined;
      const { site, contacts, active, ...fields } = found;
      const infant = Object.assign(new InfantEntity(), fields);
      const names = new Map<string, string>();
      const [{ nurse_name: nurseName, consultant_name: consultantName }] = raw as Array<{ nurse_name: string | null; consultant_name: string | null }>;
      if (infant.nurseId && nurseName) names.set(infant.nurseId, nurseName);
      if (infant.consultantId && consultantName) names.set(infant.consultantId, consultantName);
      return { infant, site: site!, contacts: contacts ?? [], active: active ?? null, names };
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

export interface InfantRecord {
  infant: InfantEntity; site: SiteEntity; contacts: FamilyContactEntity[]; active: PrescriptionEntity | null; names: Map<string, string>;
}
