import type { DataSource, EntityManager } from 'typeorm';
import type { PlannedCheck } from '@shared/schedule/plan-checks';
import type { SqlFilter } from '../../auth/casl-to-sql';
import { CheckEntity } from '../entities/check.entity';

export interface PlanStateRow {
  id: string; programme_id: string; status: string; off_oxygen_since: Date | null; time_zone: string; home_start: Date | null;
  version: number | null; decided_at: Date | null; reason: string | null; approved_flow_lpm: string | null;
}

export interface DayRow {
  id: string; infant_id: string; kind: string; plan_key: string; due_at: Date; due_date: string; status: string; done_at: Date | null;
  given_name: string; family_name: string; home_address: string; birth_date: string; ga_weeks: number; ga_days: number; active_flow_lpm: string | null; note: string | null;
}

export function createChecksRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(CheckEntity);
  return {
    /** Writes a check's note (why it stays open) without touching anything else. */
    setNote: (id: string, note: string, m: EntityManager): Promise<unknown> =>
      m.query(`UPDATE checks SET note = $2, updated_at = now() WHERE id = $1`, [id, note]),

    /** Whether some check was already completed by this reference (e.g. `recording:<id>`), so it is not used twice. */
    isDoneRefUsed: async (doneRef: string, m: EntityManager): Promise<boolean> =>
      (await m.query(`SELECT 1 FROM checks WHERE done_ref = $1`, [doneRef])).length > 0,

    /** Planning inputs for a page of babies in one statement (no per-baby queries). */
    planStates: (where: { programmeId?: string; infantIds?: string[] }, afterId: string, limit: number): Promise<PlanStateRow[]> =>
      ds.query(
        `SELECT i.id, i.programme_id, i.status, i.off_oxygen_since, pr.time_zone,
                (SELECT min(x.decided_at) FROM prescriptions x WHERE x.infant_id = i.id AND x.status IN ('active','superseded')) AS home_start,
                a.version, a.decided_at, a.reason, a.approved_flow_lpm
           FROM infants i JOIN programmes pr ON pr.id = i.programme_id
           LEFT JOIN prescriptions a ON a.infant_id = i.id AND a.status = 'active'
          WHERE ($1::uuid IS NULL OR i.programme_id = $1) AND ($2::uuid[] IS NULL OR i.id = ANY($2)) AND i.id > $3
          ORDER BY i.id LIMIT $4`,
        [where.programmeId ?? null, where.infantIds ?? null, afterId, limit],
      ),

    /** Upserts plans by (infant, plan key) and cancels open checks no longer in the plan, for a batch of babies. */
    async storePlans(plans: Array<{ infantId: string; programmeId: string; checks: PlannedCheck[] }>, m?: EntityManager) {
      const q = (m ?? ds.manager).query.bind(m ?? ds.manager);
      const rows = plans.flatMap((p) => p.checks.map((c) => ({ ...c, infantId: p.infantId, programmeId: p.programmeId })));
      if (rows.length) {
        await q(
          `INSERT INTO checks (programme_id, infant_id, plan_key, kind, due_at, due_date)
           SELECT * FROM unnest($1::uuid[], $2::uuid[], $3::text[], $4::text[], $5::timestamptz[], $6::date[])
           ON CONFLICT (infant_id, plan_key) DO UPDATE SET kind = EXCLUDED.kind, due_at = EXCLUDED.due_at, due_date = EXCLUDED.due_date,
             updated_at = now(), status = CASE WHEN EXCLUDED.due_at > now() THEN 'planned' ELSE checks.status END
           WHERE checks.status IN ('planned', 'overdue')`,
          [rows.map((r) => r.programmeId), rows.map((r) => r.infantId), rows.map((r) => r.planKey), rows.map((r) => r.kind),
            rows.map((r) => r.dueAt.toISOString()), rows.map((r) => r.dueDate)],
        );
      }
      await q(
        `UPDATE checks c SET status = 'cancelled', updated_at = now()
          WHERE c.infant_id = ANY($1::uuid[]) AND c.status IN ('planned', 'overdue') AND NOT ((c.infant_id::text || '|' || c.plan_key) = ANY($2::text[]))`,
        [plans.map((p) => p.infantId), rows.map((r) => `${r.infantId}|${r.planKey}`)],
      );
    },

    /** Daily: open checks past their due time become overdue and flag their babies. */
    markOverdue: async (): Promise<number> => {
      // A bare UPDATE … RETURNING comes back from the driver as [rows, count]; a SELECT over the CTEs gives rows.
      const [row]: Array<{ n: number }> = await ds.query(
        `WITH o AS (UPDATE checks SET status = 'overdue', updated_at = now() WHERE status = 'planned' AND due_at < now() RETURNING infant_id),
              f AS (UPDATE infants SET flags = array_append(flags, 'check_overdue') WHERE id IN (SELECT infant_id FROM o) AND NOT ('check_overdue' = ANY(flags)) RETURNING id)
         SELECT count(*)::int AS n FROM f`,
      );
      return row.n;
    },

    forInfant: (infantId: string) => repo().find({ where: { infantId }, order: { dueAt: 'ASC' } }),
    findOpen: (id: string, infantId: string, m: EntityManager) =>
      repo(m).createQueryBuilder('c').setLock('pessimistic_write').where('c.id = :id AND c.infant_id = :infantId', { id, infantId })
        .andWhere("c.status IN ('planned','overdue')").getOne(),
    /** Open checks of a kind for a baby, oldest due first: a result completes the earliest one. */
    openOfKinds: (infantId: string, kinds: string[], m: EntityManager) =>
      repo(m).createQueryBuilder('c').where('c.infant_id = :infantId', { infantId }).andWhere('c.kind = ANY(:kinds)', { kinds })
        .andWhere("c.status IN ('planned','overdue')").orderBy('c.due_at', 'ASC').getMany(),
    async complete(check: CheckEntity, by: string | null, ref: string, m: EntityManager) {
      Object.assign(check, { status: 'done', doneAt: new Date(), doneBy: by, doneRef: ref });
      await repo(m).save(check);
      await m.query(
        `UPDATE infants SET flags = array_remove(flags, 'check_overdue')
          WHERE id = $1 AND NOT EXISTS (SELECT 1 FROM checks WHERE infant_id = $1 AND status = 'overdue')`,
        [check.infantId],
      );
    },

    /**
     * The nurse's day: open checks due by `until`, and those done during `today` (in `timeZone`), on babies the
     * caller may read. Done ones stay so the round keeps its order and numbers all day while readings are saved.
     */
    day: (acl: SqlFilter, today: string, until: string, timeZone: string): Promise<DayRow[]> =>
      ds.createQueryBuilder()
        .select(['c.id AS id', 'c.infant_id AS infant_id', 'c.kind AS kind', 'c.plan_key AS plan_key', 'c.due_at AS due_at', 'c.due_date::text AS due_date',
          'c.status AS status', 'c.done_at AS done_at', 'c.note AS note', 'i.given_name AS given_name', 'i.family_name AS family_name', 'i.home_address AS home_address',
          'i.birth_date::text AS birth_date', 'i.ga_weeks AS ga_weeks', 'i.ga_days AS ga_days', 'p.approved_flow_lpm AS active_flow_lpm'])
        .from('checks', 'c')
        .innerJoin('infants', 'i', 'i.id = c.infant_id')
        .leftJoin('prescriptions', 'p', "p.infant_id = i.id AND p.status = 'active'")
        .where("(c.status IN ('planned','overdue') OR (c.status = 'done' AND (c.done_at AT TIME ZONE :timeZone)::date = CAST(:today AS date)))", { timeZone, today })
        // Step-down reviews are the consultant's; the round holds what a nurse does at the door or overnight.
        .andWhere("c.kind <> 'step_down_review'")
        .andWhere('c.due_date <= :until', { until })
        .andWhere(acl.sql, acl.params)
        .orderBy('CASE WHEN c.due_date <= CAST(:today AS date) THEN 0 ELSE 1 END', 'ASC')
        .addOrderBy('c.due_at', 'ASC')
        // A tie on the due time must not swap two stops between one load of the day and the next.
        .addOrderBy('c.id', 'ASC')
        .limit(300)
        .getRawMany(),
  };
}
export type ChecksRepository = ReturnType<typeof createChecksRepository>;
