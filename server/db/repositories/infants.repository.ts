import type { DataSource, EntityManager, SelectQueryBuilder } from 'typeorm';
import type { ListInfantsQuery } from '../../../shared/schemas/infants';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { InfantEntity } from '../entities/infant.entity';

export const INFANT_ACL_COLUMNS = { programmeId: 'i.programme_id', nurseId: 'i.nurse_id', id: 'i.id' };

// Corrected age grows as the term-equivalent date gets earlier; elevation grows as pressure falls.
const SORTS: Record<string, [string, 'ASC' | 'DESC'][]> = {
  name: [['i.family_name', 'ASC'], ['i.given_name', 'ASC']],
  correctedAge: [['i.term_date', 'DESC']],
  elevation: [['i.home_pressure_mmhg', 'DESC']],
  status: [['i.status', 'ASC']],
  enrolled: [['i.created_at', 'ASC']],
};

export interface InfantListRow {
  id: string; given_name: string; family_name: string; birth_date: string; ga_weeks: number; ga_days: number;
  home_elevation_m: string | null; home_pressure_mmhg: string; status: string; flags: string[];
  nurse_id: string | null; nurse_name: string | null; consultant_id: string | null; consultant_name: string | null;
  active_flow_lpm: string | null; total: string;
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
  return {
    /** One statement: the page and the total (window count), filtered by the caller's ability in SQL. */
    async list(query: ListInfantsQuery, acl: SqlFilter, extra?: SqlFilter): Promise<InfantListRow[]> {
      const qb = withPeople(
        ds.createQueryBuilder().select(['i.id AS id', 'i.given_name AS given_name', 'i.family_name AS family_name',
          'i.birth_date::text AS birth_date', 'i.ga_weeks AS ga_weeks', 'i.ga_days AS ga_days', 'i.home_elevation_m AS home_elevation_m',
          'i.home_pressure_mmhg AS home_pressure_mmhg', 'i.status AS status', 'i.flags AS flags', 'i.nurse_id AS nurse_id',
          'i.consultant_id AS consultant_id', 'count(*) OVER() AS total']).from('infants', 'i'),
      ).where(acl.sql, acl.params);
      if (extra) qb.andWhere(extra.sql, extra.params);
      if (query.status) qb.andWhere('i.status = :status', { status: query.status });
      if (query.flag) qb.andWhere(':flag = ANY(i.flags)', { flag: query.flag });
      if (query.q) {
        const q = `%${query.q.replace(/[%_\\]/g, '\\$&')}%`;
        qb.andWhere("(i.given_name || ' ' || i.family_name ILIKE :q OR i.family_name ILIKE :q)", { q });
      }
      const desc = query.sort.startsWith('-');
      for (const [col, dir] of SORTS[query.sort.replace('-', '')]) qb.addOrderBy(col, desc ? (dir === 'ASC' ? 'DESC' : 'ASC') : dir);
      qb.addOrderBy('i.id', 'ASC').offset((query.page - 1) * query.pageSize).limit(query.pageSize);
      return qb.getRawMany();
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
