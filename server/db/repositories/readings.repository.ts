import type { DataSource, EntityManager } from 'typeorm';
import type { PolicySettings } from '@shared/schemas/policy';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { InfantEntity } from '../entities/infant.entity';
import { ProgrammePolicyEntity } from '../entities/programme-policy.entity';
import { ReadingEntity } from '../entities/reading.entity';
import { UserEntity } from '../entities/user.entity';

/** The readings list's one read: the baby the caller may read, its readings in a window, who logged each, the policy. */
export interface InfantReadings {
  infant: InfantEntity;
  readings: ReadingEntity[];
  /** The name of each person who logged one of the readings, by id. */
  names: Map<string, string>;
  /** The programme's current policy settings as stored, null when it has none yet. */
  policySettings: Partial<PolicySettings> | null;
}

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
    /**
     * A baby's readings between two times, oldest first (2,000 at most), in one statement with the baby itself when
     * the caller may read it (undefined when not), the names of the people who logged them and the programme's
     * current policy (its edit window).
     */
    async forInfant(infantId: string, acl: SqlFilter, from: Date, to: Date): Promise<InfantReadings | undefined> {
      const { entities, raw } = await ds.manager.getRepository(InfantEntity).createQueryBuilder('i')
        .leftJoinAndMapMany('i.readings', ReadingEntity, 'r', 'r.infant_id = i.id AND r.taken_at BETWEEN :from AND :to', { from, to })
        .leftJoin(UserEntity, 'u', 'u.id = r.created_by').addSelect('u.name', 'created_by_name')
        .addSelect((q) => q.select('pp.settings').from(ProgrammePolicyEntity, 'pp').where('pp.programme_id = i.programme_id').orderBy('pp.version', 'DESC').limit(1), 'policy_settings')
        .where('i.id = :infantId', { infantId }).andWhere(acl.sql, acl.params)
        .orderBy('r.taken_at', 'ASC').limit(2000)
        .getRawAndEntities();
      const found = entities[0] as (InfantEntity & { readings?: ReadingEntity[] }) | undefined;
      if (!found) return undefined;
      const { readings, ...fields } = found;
      const rows = raw as Array<{ r_created_by: string | null; created_by_name: string | null; policy_settings: Partial<PolicySettings> | null }>;
      const names = new Map(rows.flatMap((r) => (r.r_created_by && r.created_by_name ? [[r.r_created_by, r.created_by_name] as const] : [])));
      return { infant: Object.assign(new InfantEntity(), fields), readings: readings ?? [], names, policySettings: rows[0]!.policy_settings };
    },

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
