import type { DataSource, EntityManager } from 'typeorm';
import { In } from 'typeorm';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { PrescriptionEntity } from '../entities/prescription.entity';

// Prescriptions carry programme_id and infant_id; nurse rules need the infant's nurse, so the ACL joins infants.
export const PRESCRIPTION_ACL_COLUMNS = { programmeId: 'rx.programme_id', infantId: 'rx.infant_id', status: 'rx.status', nurseId: 'i.nurse_id' };

export interface QueueRow {
  id: string; infant_id: string; given_name: string; family_name: string; birth_date: string; ga_weeks: number; ga_days: number;
  home_elevation_m: string | null; home_pressure_mmhg: string; site_name: string; reason: string;
  proposed_flow_lpm: string | null; result: { feasible: boolean; warnings: unknown[] } | null; evidence: unknown; created_at: Date;
}

export function createPrescriptionsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(PrescriptionEntity);
  const visible = (acl: SqlFilter, m?: EntityManager) =>
    repo(m).createQueryBuilder('rx').innerJoin('infants', 'i', 'i.id = rx.infant_id').where(acl.sql, acl.params);
  return {
    /** The newest superseded setting with oxygen (flow above 0): where a step back up returns to. */
    lastSupersededWithFlow: async (infantId: string, m: EntityManager): Promise<{ approved_flow_lpm: string; periods: PrescriptionEntity['periods'] } | null> =>
      (await m.query(`SELECT approved_flow_lpm, periods FROM prescriptions WHERE infant_id = $1 AND status = 'superseded' AND approved_flow_lpm > 0 ORDER BY version DESC LIMIT 1`, [infantId]))[0] ?? null,

    listForInfant: (infantId: string, acl: SqlFilter) =>
      visible(acl).andWhere('rx.infant_id = :infantId', { infantId }).orderBy('rx.version', 'DESC').getMany(),
    findVisible: (id: string, acl: SqlFilter) => visible(acl).andWhere('rx.id = :id', { id }).getOne(),
    findById: (id: string, m?: EntityManager) => repo(m).findOne({ where: { id } }),
    findForUpdate: (id: string, m: EntityManager) =>
      repo(m).createQueryBuilder('rx').setLock('pessimistic_write').where('rx.id = :id', { id }).getOne(),
    active: (infantId: string, m?: EntityManager) => repo(m).findOne({ where: { infantId, status: 'active' } }),
    nextVersion: async (infantId: string, m: EntityManager) => {
      const [row] = await m.query(`SELECT coalesce(max(version), 0) + 1 AS v FROM prescriptions WHERE infant_id = $1`, [infantId]);
      return Number(row.v);
    },
    /** True while a proposal for this baby is being worked out or waits for sign-off. */
    hasPending: async (infantId: string, m: EntityManager) =>
      (await m.query(`SELECT 1 FROM prescriptions WHERE infant_id = $1 AND status IN ('preparing','proposed') LIMIT 1`, [infantId])).length > 0,
    /** A newer proposal replaces any still pending, so only one ever waits for sign-off per baby. */
    withdrawPending: (infantId: string, m: EntityManager) =>
      repo(m).update({ infantId, status: In(['preparing', 'proposed']) }, { status: 'withdrawn' }),
    insert: (data: Partial<PrescriptionEntity>, m: EntityManager) => repo(m).save(repo(m).create(data)),
    save: (rx: PrescriptionEntity, m: EntityManager) => repo(m).save(rx),
    /** Ids still being worked out after `olderThanSeconds`: the reconciler re-enqueues these. */
    stalePreparing: async (olderThanSeconds: number): Promise<string[]> => {
      const rows: Array<{ id: string }> = await ds.query(
        `SELECT id FROM prescriptions WHERE status = 'preparing' AND created_at < now() - make_interval(secs => $1) ORDER BY created_at LIMIT 1000`,
        [olderThanSeconds],
      );
      return rows.map((r) => r.id);
    },
    queue: (acl: SqlFilter): Promise<QueueRow[]> =>
      ds.createQueryBuilder()
        .select(['rx.id AS id', 'rx.infant_id AS infant_id', 'i.given_name AS given_name', 'i.family_name AS family_name',
          'i.birth_date::text AS birth_date', 'i.ga_weeks AS ga_weeks', 'i.ga_days AS ga_days', 'i.home_elevation_m AS home_elevation_m',
          'i.home_pressure_mmhg AS home_pressure_mmhg', 's.name AS site_name', 'rx.reason AS reason', 'rx.proposed_flow_lpm AS proposed_flow_lpm',
          'rx.result AS result', 'rx.evidence AS evidence', 'rx.created_at AS created_at'])
        .from('prescriptions', 'rx')
        .innerJoin('infants', 'i', 'i.id = rx.infant_id')
        .innerJoin('sites', 's', 's.id = i.site_id')
        .where("rx.status = 'proposed'")
        .andWhere(acl.sql, acl.params)
        .orderBy('rx.created_at', 'ASC')
        .limit(500)
        .getRawMany(),
  };
}
export type PrescriptionsRepository = ReturnType<typeof createPrescriptionsRepository>;
