import type { DataSource } from 'typeorm';
import type { AppAbility } from '@shared/auth/ability';
import type { DecisionInput, QueueItem } from '@shared/schemas/prescriptions';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import { PRESCRIPTION_ACL_COLUMNS } from '../../db/repositories/prescriptions.repository';
import type { AppRepos } from '../../deps';
import type { JobProducer } from '../../jobs/producer';
import { NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { todayIn } from '../../lib/dates';
import { correctedAgeText } from '../infants/infants.mapper';
import { decidePrescription } from './decide';
import { systemClock, type Clock } from '../../lib/clock';
import { unmetInEvidence } from '@shared/schedule/step-down-rules';
import { forFamily, toPrescriptionDto } from './prescriptions.mapper';

export function createPrescriptionsService(ds: DataSource, repos: AppRepos, jobs: JobProducer, clock: Clock = systemClock) {
  return {
    async listForInfant(ability: AppAbility, infantId: string, role?: string) {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant) throw new NotFoundError('No such baby in your records.');
      const rows = await repos.prescriptions.listForInfant(infantId, accessibleWhere(ability, 'read', 'Prescription', PRESCRIPTION_ACL_COLUMNS));
      const names = await repos.infants.peopleNames(rows.map((r) => r.decidedBy));
      const items = rows.map((r) => toPrescriptionDto(r, names));
      return { items: role === 'family' ? items.map(forFamily) : items };
    },

    /** One mapping per audience: a family gets the same reduced view as from the list, never the working or notes. */
    async get(ability: AppAbility, id: string, role?: string) {
      const rx = await repos.prescriptions.findVisible(id, accessibleWhere(ability, 'read', 'Prescription', PRESCRIPTION_ACL_COLUMNS));
      if (!rx) throw new NotFoundError('No such setting in your records.');
      const dto = toPrescriptionDto(rx, await repos.infants.peopleNames([rx.decidedBy]));
      return role === 'family' ? forFamily(dto) : dto;
    },

    async queue(ability: AppAbility, timeZone: string): Promise<{ items: QueueItem[] }> {
      const rows = await repos.prescriptions.queue(accessibleWhere(ability, 'approve', 'Prescription', PRESCRIPTION_ACL_COLUMNS));
      const today = todayIn(timeZone);
      return {
        items: rows.map((r) => ({
          prescriptionId: r.id, infantId: r.infant_id, infantName: `${r.given_name} ${r.family_name}`,
          correctedAge: correctedAgeText(r.birth_date, r.ga_weeks, r.ga_days, today),
          homeElevationM: r.home_elevation_m === null ? null : Number(r.home_elevation_m), homePressureMmHg: Number(r.home_pressure_mmhg),
          siteName: r.site_name, reason: r.reason as QueueItem['reason'],
          proposedFlowLpm: r.proposed_flow_lpm === null ? null : Number(r.proposed_flow_lpm),
          feasible: r.result ? r.result.feasible : r.proposed_flow_lpm !== null, warningCount: r.result?.warnings.length ?? 0,
          unmetChecks: unmetInEvidence(r.evidence).length, waitingSince: new Date(r.created_at).toISOString(),
        })),
      };
    },

    async decide(ability: AppAbility, actor: Actor, id: string, input: DecisionInput) {
      const rx = await decidePrescription(ds, repos, ability, actor, id, input, clock.now());
      // A new active setting changes which checks and reviews are due.
      if (rx.status === 'active') await jobs.enqueuePlanInfant(rx.infantId);
      return toPrescriptionDto(rx, await repos.infants.peopleNames([rx.decidedBy]));
    },
  };
}
export type PrescriptionsService = ReturnType<typeof createPrescriptionsService>;
