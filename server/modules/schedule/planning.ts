import { planChecks, type PlanState } from '@shared/schedule/plan-checks';
import type { PolicySettings } from '@shared/schemas/policy';
import type { PlanStateRow } from '../../db/repositories/checks.repository';
import type { AppRepos } from '../../deps';

const FIRST_ID = '00000000-0000-0000-0000-000000000000';

function stateOf(r: PlanStateRow): PlanState {
  return {
    homeStartAt: r.home_start ? new Date(r.home_start) : null,
    status: r.status,
    offOxygenSince: r.off_oxygen_since ? new Date(r.off_oxygen_since) : null,
    active: r.version !== null && r.decided_at
      ? { version: r.version, approvedAt: new Date(r.decided_at), reason: r.reason ?? 'enrolment', flowLpm: Number(r.approved_flow_lpm ?? 0) }
      : null,
  };
}

/**
 * Re-plans checks for a programme or a list of babies in pages: one read and two writes per page, whatever the
 * page size (docs/service-targets.md P6: linear in babies, no per-baby queries). Safe to repeat: storage is an upsert by key.
 */
export async function replan(repos: AppRepos, where: { programmeId?: string; infantIds?: string[] }, now = new Date(), pageSize = 500) {
  const policies = new Map<string, PolicySettings>();
  let after = FIRST_ID;
  let planned = 0;
  for (;;) {
    const rows = await repos.checks.planStates(where, after, pageSize);
    if (!rows.length) break;
    for (const id of new Set(rows.map((r) => r.programme_id))) {
      if (!policies.has(id)) policies.set(id, (await repos.policies.current(id)).settings);
    }
    const plans = rows.map((r) => ({ infantId: r.id, programmeId: r.programme_id, checks: planChecks(stateOf(r), policies.get(r.programme_id)!, r.time_zone, now) }));
    await repos.checks.storePlans(plans);
    planned += rows.length;
    after = rows[rows.length - 1].id;
    if (rows.length < pageSize) break;
  }
  return { planned };
}
