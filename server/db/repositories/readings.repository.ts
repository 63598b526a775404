import type { DataSource, EntityManager } from 'typeorm';
import { ReadingEntity } from '../entities/reading.entity';

export function createReadingsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(ReadingEntity);
  return {
    insert: (data: Partial<ReadingEntity>, m: EntityManager) => repo(m).save(repo(m).create(data)),
    save: (r: ReadingEntity, m: EntityManager) => repo(m).save(r),
    findForUpdate: (id: string, m: EntityManager) => repo(m).createQueryBuilder('r').setLock('pessimistic_write').where('r.id = :id', { id }).getOne(),
    between: (infantId: string, from: Date, to: Date) =>
      repo().createQueryBuilder('r').where('r.infant_id = :infantId', { infantId }).andWhere('r.taken_at BETWEEN :from AND :to', { from, to })
        .orderBy('r.taken_at', 'ASC').limit(2000).getMany(),
    /** Every reading of one baby, oldest first, for an export that must not stop at a page. */
    allForInfant: (infantId: string) => repo().find({ where: { infantId }, order: { takenAt: 'ASC', id: 'ASC' } }),
  };
}
export type ReadingsRepository = ReturnType<typeof createReadingsRepository>;
