import type { DataSource, EntityManager } from 'typeorm';
import { ReadingEntity } from '../entities/reading.entity';

/** A reading as an export writes it, with the name of the person who logged it and its keyset position as exact text. */
export interface ReadingExportRow {
  id: string; taken_at: Date; spo2: number; pulse: number | null; flow_lpm: string | null; state: string; weight_kg: string | null;
  notes: string | null; family_reported: boolean; created_by_name: string | null; created_at: Date; k_taken_at: string;
}

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

    /** One page of a baby's readings after a position, oldest first, within an optional time window. */
    exportPage: (infantId: string, window: { from?: string; to?: string }, after: { takenAt: string; id: string } | undefined, limit: number): Promise<ReadingExportRow[]> =>
      ds.query(
        `SELECT r.id, r.taken_at, r.spo2, r.pulse, r.flow_lpm, r.state, r.weight_kg, r.notes, r.family_reported, u.name AS created_by_name,
                r.created_at, r.taken_at::text AS k_taken_at
           FROM readings r LEFT JOIN users u ON u.id = r.created_by
          WHERE r.infant_id = $1 AND ($2::timestamptz IS NULL OR r.taken_at >= $2) AND ($3::timestamptz IS NULL OR r.taken_at <= $3)
            AND ($4::timestamptz IS NULL OR (r.taken_at, r.id) > ($4::timestamptz, $5::uuid))
          ORDER BY r.taken_at, r.id LIMIT $6`,
        [infantId, window.from ?? null, window.to ?? null, after?.takenAt ?? null, after?.id ?? null, limit],
      ),
  };
}
export type ReadingsRepository = ReturnType<typeof createReadingsRepository>;
