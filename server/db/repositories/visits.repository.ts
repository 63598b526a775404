import type { DataSource, EntityManager } from 'typeorm';
import { VisitEntity } from '../entities/visit.entity';
import { InfantEntity } from '../entities/infant.entity';
import type { SqlFilter } from '../../auth/casl-to-sql';

export function createVisitsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(VisitEntity);
  return {
    /** Booked visits with this person on a local date, of babies the caller may read, by start time. */
    forStaffOn: (staffId: string, date: string, acl: SqlFilter): Promise<Array<VisitEntity & { infantName: string; homeAddress: string }>> =>
      repo().createQueryBuilder('v').innerJoin(InfantEntity, 'i', 'i.id = v.infant_id')
        .addSelect(["i.given_name || ' ' || i.family_name AS infant_name", 'i.home_address AS home_address'])
        .where('v.staff_id = :staffId', { staffId }).andWhere('v.local_date = :date', { date }).andWhere("v.status = 'booked'")
        .andWhere(acl.sql, acl.params).orderBy('v.starts_at', 'ASC').limit(100)
        .getRawAndEntities()
        .then(({ entities, raw }) => entities.map((e, n) => Object.assign(e, { infantName: raw[n].infant_name as string, homeAddress: raw[n].home_address as string }))),
    insert: (data: Partial<VisitEntity>, m: EntityManager) => repo(m).save(repo(m).create(data)),
    save: (v: VisitEntity, m: EntityManager) => repo(m).save(v),
    findForUpdate: (id: string, m: EntityManager) => repo(m).createQueryBuilder('v').setLock('pessimistic_write').where('v.id = :id', { id }).getOne(),
    /** Booked visits from a moment on, plus the last few weeks' for context, oldest first. */
    forInfant: (infantId: string, since: Date) =>
      repo().createQueryBuilder('v').where('v.infant_id = :infantId', { infantId }).andWhere('v.starts_at >= :since', { since })
        .orderBy('v.starts_at', 'ASC').limit(200).getMany(),
  };
}
export type VisitsRepository = ReturnType<typeof createVisitsRepository>;
