import type { DataSource, EntityManager } from 'typeorm';
import { VisitEntity } from '../entities/visit.entity';

export function createVisitsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(VisitEntity);
  return {
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
