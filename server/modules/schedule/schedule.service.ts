import type { AppAbility } from '@shared/auth/ability';
import type { Check, DayItem, MyDay } from '@shared/schemas/schedule';
import { accessibleWhere } from '../../auth/casl-to-sql';
import type { CheckEntity } from '../../db/entities/check.entity';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import { NotFoundError } from '../../lib/errors';
import { correctedAgeText } from '../infants/infants.mapper';
import { addDays } from '@shared/clinical/dates';

const toCheck = (c: CheckEntity): Check => ({
  id: c.id, infantId: c.infantId, kind: c.kind, planKey: c.planKey, dueAt: c.dueAt.toISOString(), dueDate: c.dueDate, status: c.status,
  doneAt: c.doneAt?.toISOString() ?? null, note: c.note,
});

export function createScheduleService(repos: AppRepos) {
  return {
    async forInfant(ability: AppAbility, infantId: string) {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant) throw new NotFoundError('No such baby in your records.');
      const all = await repos.checks.forInfant(infantId);
      return {
        upcoming: all.filter((c) => c.status === 'planned').map(toCheck),
        overdue: all.filter((c) => c.status === 'overdue').map(toCheck),
        done: all.filter((c) => c.status === 'done').slice(-10).reverse().map(toCheck),
      };
    },

    async day(ability: AppAbility, today: string, userId: string, timeZone: string): Promise<MyDay> {
      const rows = await repos.checks.day(accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS), today, addDays(today, 7), timeZone);
      const all = rows.map((r): DayItem => ({
        id: r.id, infantId: r.infant_id, kind: r.kind as DayItem['kind'], planKey: r.plan_key, dueAt: new Date(r.due_at).toISOString(), dueDate: r.due_date,
        status: r.status as DayItem['status'], doneAt: r.done_at ? new Date(r.done_at).toISOString() : null, note: r.note,
        infantName: `${r.given_name} ${r.family_name}`, homeAddress: r.home_address,
        activeFlowLpm: r.active_flow_lpm === null ? null : Number(r.active_flow_lpm),
        correctedAge: correctedAgeText(r.birth_date, r.ga_weeks, r.ga_days, today),
      }));
      const visits = await repos.visits.forStaffOn(userId, today, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      return {
        // Today's round keeps the checks already done today in their places; the week ahead lists only what is still open.
        date: today, items: all.filter((i) => i.dueDate <= today || i.status === 'done'), upcoming: all.filter((i) => i.dueDate > today && i.status !== 'done'),
        visits: visits.map((v) => ({
          id: v.id, infantId: v.infantId, infantName: v.infantName, homeAddress: v.homeAddress, kind: v.kind, date: v.localDate, time: v.localTime,
          startsAt: v.startsAt.toISOString(), durationMinutes: v.durationMinutes, purpose: v.purpose,
        })),
      };
    },
  };
}
export type ScheduleService = ReturnType<typeof createScheduleService>;
