import type { DataSource } from 'typeorm';
import type { SqlFilter } from '../../auth/casl-to-sql';

// Each figure is one aggregate statement over rows the caller's ability allows (the `acl` filters use the same
// column names as the list queries: i = infants, rx = prescriptions, j = journeys, u = users), so an overview never
// counts a record its list page would not show.

export interface WaitingRow { n: number; oldest: Date | null }
export interface JourneyWaitingRow { id: string; infant_name: string; destination_name: string; depart_on: string; created_at: Date }
export interface StepDownWaitingRow { id: string; infant_name: string; evidence: unknown; created_at: Date }

/** An approved setting with oxygen in it: a flow above zero, or oxygen in some part of the day. */
const ON_OXYGEN = `(v.approved_flow_lpm > 0 OR EXISTS (SELECT 1 FROM jsonb_each_text(coalesce(v.periods, '{}'::jsonb)) e WHERE e.value::numeric > 0))`;

export function createOverviewRepository(ds: DataSource) {
  const run = async <T>(sql: string, named: Record<string, unknown>): Promise<T[]> => {
    const [text, params] = ds.driver.escapeQueryWithParameters(sql, named);
    return ds.query(text, params);
  };
  return {
    babiesByStatus: (acl: SqlFilter) =>
      run<{ status: string; n: number }>(`SELECT i.status, count(*)::int AS n FROM infants i WHERE ${acl.sql} GROUP BY i.status`, acl.params),

    /** Proposals waiting for a consultant (the sign-off queue's rows: status 'proposed'). */
    proposalsWaiting: async (acl: SqlFilter): Promise<WaitingRow> =>
      (await run<WaitingRow>(
        `SELECT count(*)::int AS n, min(rx.created_at) AS oldest FROM prescriptions rx JOIN infants i ON i.id = rx.infant_id
          WHERE rx.status = 'proposed' AND ${acl.sql}`, acl.params))[0],

    /** Step-down proposals waiting, with the evidence they were asked for on (which holds the unmet rules), oldest first. */
    stepDownsWaiting: (acl: SqlFilter) =>
      run<StepDownWaitingRow>(
        `SELECT rx.id, i.given_name || ' ' || i.family_name AS infant_name, rx.evidence, rx.created_at
           FROM prescriptions rx JOIN infants i ON i.id = rx.infant_id
          WHERE rx.status = 'proposed' AND rx.reason = 'step_down' AND ${acl.sql}
          ORDER BY rx.created_at, rx.id LIMIT 500`, acl.params),

    /** Journey checks waiting for a consultant (the journeys' 'waiting' list), with the oldest few named. */
    async journeysWaiting(acl: SqlFilter, listed: number): Promise<WaitingRow & { oldestItems: JourneyWaitingRow[] }> {
      const from = `FROM journeys j JOIN infants i ON i.id = j.infant_id WHERE j.status = 'waiting' AND ${acl.sql}`;
      const [[head], oldestItems] = await Promise.all([
        run<WaitingRow>(`SELECT count(*)::int AS n, min(j.created_at) AS oldest ${from}`, acl.params),
        run<JourneyWaitingRow>(
          `SELECT j.id, i.given_name || ' ' || i.family_name AS infant_name, j.destination_name, j.depart_on::text AS depart_on, j.created_at
           ${from} ORDER BY j.created_at, j.id LIMIT :listed`, { ...acl.params, listed }),
      ]);
      return { ...head, oldestItems };
    },

    /**
     * Open checks (planned, or already marked overdue by the daily run) whose due time is before `now`: the same
     * test the daily run applies, taken at the caller's clock so the figure does not wait for that run.
     */
    overdueChecks: async (acl: SqlFilter, now: Date) =>
      (await run<{ n: number; babies: number }>(
        `SELECT count(*)::int AS n, count(DISTINCT c.infant_id)::int AS babies FROM checks c JOIN infants i ON i.id = c.infant_id
          WHERE c.status IN ('planned', 'overdue') AND c.due_at < :now AND ${acl.sql}`, { ...acl.params, now }))[0],

    /** The message log's rows (staff messages of the programme, family ones about babies the caller may read) by status. */
    messagesByStatus: (programmeId: string, infantAcl: SqlFilter, statuses: string[], since: Date | null) =>
      run<{ status: string; n: number }>(
        `SELECT r.status, count(*)::int AS n FROM reminders r
          WHERE r.programme_id = :programmeId AND r.status IN (:...statuses) AND (CAST(:since AS timestamptz) IS NULL OR r.send_at >= :since)
            AND (r.infant_id IS NULL OR EXISTS (SELECT 1 FROM infants i WHERE i.id = r.infant_id AND ${infantAcl.sql}))
          GROUP BY r.status`, { ...infantAcl.params, programmeId, statuses, since }),

    peopleByRole: (acl: SqlFilter) =>
      run<{ role: string; active: number; disabled: number }>(
        `SELECT u.role, count(*) FILTER (WHERE NOT u.disabled)::int AS active, count(*) FILTER (WHERE u.disabled)::int AS disabled
           FROM users u WHERE ${acl.sql} GROUP BY u.role`, acl.params),

    /** Monday 00:00 of the current week in the time zone, as an instant. */
    weekStart: async (timeZone: string, now: Date): Promise<Date> =>
      (await run<{ at: Date }>(`SELECT date_trunc('week', CAST(:now AS timestamptz) AT TIME ZONE :tz) AT TIME ZONE :tz AS at`, { now, tz: timeZone }))[0].at,

    /**
     * Babies on home oxygen at any time in each of the last `months` calendar months (time zone's months, the
     * current one up to `now`). Each approved version is in force from its decision until the next approved
     * version of the same baby; a version counts if it holds oxygen.
     */
    onOxygenByMonth: (acl: SqlFilter, timeZone: string, now: Date, months: number) =>
      run<{ month: string; n: number }>(
        `WITH local_months AS (
           SELECT generate_series(date_trunc('month', CAST(:now AS timestamptz) AT TIME ZONE :tz) - make_interval(months => :back),
                                  date_trunc('month', CAST(:now AS timestamptz) AT TIME ZONE :tz), interval '1 month') AS m),
         bounds AS (SELECT m, m AT TIME ZONE :tz AS starts, (m + interval '1 month') AT TIME ZONE :tz AS ends FROM local_months),
         v AS (
           SELECT rx.infant_id, rx.approved_flow_lpm, rx.periods, rx.decided_at AS from_at,
                  lead(rx.decided_at) OVER (PARTITION BY rx.infant_id ORDER BY rx.decided_at, rx.version) AS to_at
             FROM prescriptions rx JOIN infants i ON i.id = rx.infant_id
            WHERE rx.status IN ('active', 'superseded') AND rx.decided_at IS NOT NULL AND ${acl.sql})
         SELECT to_char(b.m, 'YYYY-MM') AS month, count(DISTINCT v.infant_id)::int AS n
           FROM bounds b LEFT JOIN v ON ${ON_OXYGEN} AND v.from_at < least(b.ends, CAST(:now AS timestamptz)) AND (v.to_at IS NULL OR v.to_at > b.starts)
          GROUP BY b.m ORDER BY b.m`,
        { ...acl.params, now, tz: timeZone, back: months - 1 }),
  };
}
export type OverviewRepository = ReturnType<typeof createOverviewRepository>;
