import type { AppAbility } from '@shared/auth/ability';
import { ROLES } from '@shared/auth/roles';
import { INFANT_STATUSES } from '@shared/schemas/infants';
import {
  JOURNEYS_LISTED, ON_OXYGEN_MONTHS, type AdminOverview, type ConsultantOverview, type CoordinatorOverview, type MonthCount,
} from '@shared/schemas/overview';
import { unmetInEvidence } from '@shared/schedule/step-down-rules';
import { missingForDischarge } from '@shared/discharge/readiness';
import { SETTING_APPROVED_KEY } from '@shared/schemas/discharge-policy';
import { DISCHARGES_LISTED } from '@shared/schemas/overview';
import { todayIn } from '../../lib/dates';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import { JOURNEY_ACL_COLUMNS } from '../../db/repositories/journeys.repository';
import { PRESCRIPTION_ACL_COLUMNS } from '../../db/repositories/prescriptions.repository';
import { USER_ACL_COLUMNS } from '../../db/repositories/users.repository';
import { ORDER_ACL_COLUMNS } from '../../db/repositories/equipment-orders.repository';
import type { AppRepos } from '../../deps';

/** Who is asking: the programme whose figures these are, its time zone (months, weeks) and the instant of "now". */
export interface OverviewCaller { programmeId: string; timeZone: string; now: Date }

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
const countOf = (rows: { status: string; n: number }[], status: string) => rows.find((r) => r.status === status)?.n ?? 0;

export function createOverviewService(repos: AppRepos) {
  const { overview } = repos;
  const infants = (ability: AppAbility) => accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS);

  async function onOxygenByMonth(ability: AppAbility, c: OverviewCaller): Promise<MonthCount[]> {
    const rows = await overview.onOxygenByMonth(infants(ability), c.timeZone, c.now, ON_OXYGEN_MONTHS);
    return rows.map((r) => ({ month: r.month, count: r.n }));
  }

  /** Babies going home: a date from today on, or work begun; each with what is still missing under the current policy. */
  async function dischargesAhead(ability: AppAbility, c: OverviewCaller): Promise<CoordinatorOverview['discharges']> {
    const [rows, policy] = await Promise.all([
      // Counted from at most 500 rows: far more than a programme has about to go home at once.
      repos.discharges.upcoming(infants(ability), todayIn(c.timeZone, c.now), 500),
      repos.policies.current(c.programmeId),
    ]);
    const rules = policy.settings.discharge.items;
    const labels = new Map<string, string>([[SETTING_APPROVED_KEY, 'Setting approved by a consultant'], ...rules.map((r) => [r.key, r.label] as [string, string])]);
    const babies = rows.map((r) => ({
      infantId: r.infant_id, infantName: r.infant_name, dischargedOn: r.discharged_on,
      missing: missingForDischarge(rules, r.done_keys.map((key) => ({ key, done: true, evidence: null })), r.setting_approved)
        .map((key) => ({ key, label: labels.get(key) ?? key })),
    }));
    return {
      withDate: babies.filter((b) => b.dischargedOn).length,
      preparing: babies.filter((b) => !b.dischargedOn).length,
      babies: babies.slice(0, DISCHARGES_LISTED),
    };
  }

  return {
    async coordinator(ability: AppAbility, c: OverviewCaller): Promise<CoordinatorOverview> {
      const [statuses, signOff, overdue, messages, journeys, months, discharges, orders] = await Promise.all([
        overview.babiesByStatus(infants(ability)),
        overview.proposalsWaiting(accessibleWhere(ability, 'read', 'Prescription', PRESCRIPTION_ACL_COLUMNS)),
        overview.overdueChecks(infants(ability), c.now),
        overview.messagesByStatus(c.programmeId, infants(ability), ['failed', 'unknown'], null),
        overview.journeysWaiting(accessibleWhere(ability, 'read', 'Journey', JOURNEY_ACL_COLUMNS), JOURNEYS_LISTED),
        onOxygenByMonth(ability, c),
        dischargesAhead(ability, c),
        repos.equipmentOrders.flagCounts(accessibleWhere(ability, 'read', 'EquipmentOrder', ORDER_ACL_COLUMNS), todayIn(c.timeZone, c.now)),
      ]);
      return {
        role: 'coordinator', asOf: c.now.toISOString(),
        babiesByStatus: INFANT_STATUSES.map((status) => ({ status, count: countOf(statuses, status) })),
        signOff: { count: signOff.n, oldestSince: iso(signOff.oldest) },
        overdueChecks: { count: overdue.n, babies: overdue.babies },
        messagesNeedingAction: { failed: countOf(messages, 'failed'), unknown: countOf(messages, 'unknown') },
        journeysWaiting: {
          count: journeys.n, oldestSince: iso(journeys.oldest),
          oldest: journeys.oldestItems.map((j) => ({
            id: j.id, infantName: j.infant_name, destinationName: j.destination_name, departOn: j.depart_on, waitingSince: iso(j.created_at)!,
          })),
        },
        discharges,
        onOxygenByMonth: months,
        equipmentOrders: orders,
      };
    },

    async admin(ability: AppAbility, c: OverviewCaller): Promise<AdminOverview> {
      const since = await overview.weekStart(c.timeZone, c.now);
      const [people, policy, messages, months] = await Promise.all([
        overview.peopleByRole(accessibleWhere(ability, 'read', 'User', USER_ACL_COLUMNS)),
        repos.policies.current(c.programmeId),
        overview.messagesByStatus(c.programmeId, infants(ability), ['sent', 'failed', 'unknown'], since),
        onOxygenByMonth(ability, c),
      ]);
      return {
        role: 'admin', asOf: c.now.toISOString(),
        people: ROLES.map((role) => {
          const row = people.find((p) => p.role === role);
          return { role, active: row?.active ?? 0, disabled: row?.disabled ?? 0 };
        }),
        policy: { version: policy.version, savedAt: policy.createdAt },
        messagesThisWeek: {
          since: since.toISOString(), sent: countOf(messages, 'sent'), failed: countOf(messages, 'failed'),
          unknown: countOf(messages, 'unknown'),
        },
        onOxygenByMonth: months,
      };
    },

    async consultant(ability: AppAbility, c: OverviewCaller): Promise<ConsultantOverview> {
      const rx = accessibleWhere(ability, 'approve', 'Prescription', PRESCRIPTION_ACL_COLUMNS);
      const [proposals, journeys, stepDowns] = await Promise.all([
        overview.proposalsWaiting(rx),
        overview.journeysWaiting(accessibleWhere(ability, 'approve', 'Journey', JOURNEY_ACL_COLUMNS), 0),
        overview.stepDownsWaiting(rx),
      ]);
      return {
        role: 'consultant', asOf: c.now.toISOString(),
        proposals: { count: proposals.n, oldestSince: iso(proposals.oldest) },
        journeys: { count: journeys.n, oldestSince: iso(journeys.oldest) },
        // The same reader of the stored rule checks as the sign-off queue and the decision form.
        unmetStepDowns: stepDowns
          .map((r) => ({ prescriptionId: r.id, infantName: r.infant_name, unmetRules: unmetInEvidence(r.evidence).length, waitingSince: iso(r.created_at)! }))
          .filter((r) => r.unmetRules > 0),
      };
    },
  };
}
export type OverviewService = ReturnType<typeof createOverviewService>;
