import { journeyPlanForFamily } from '@shared/clinical/journey-plan';
import type { Journey } from '@shared/schemas/journeys';
import type { JourneyEntity } from '../../db/entities/journey.entity';

export type Audience = 'staff' | 'family';

/**
 * Staff see the whole plan with its working. A family sees its own request and status; the numbers only once a
 * consultant has approved them, and never the working, staff warnings or the decision note.
 */
export function toJourneyDto(j: JourneyEntity, infantName: string, names: Map<string, string>, audience: Audience): Journey {
  const family = audience === 'family';
  const person = (id: string) => ({ id, name: names.get(id) ?? '' });
  return {
    id: j.id,
    infantId: j.infantId,
    infantName,
    status: j.status,
    rowVersion: j.rowVersion,
    request: {
      mode: j.mode, destinationName: j.destinationName, destinationElevationM: j.destinationElevationM, cabinAltitudeFt: j.cabinAltitudeFt,
      departOn: j.departOn, returnOn: j.returnOn, hoursAway: j.hoursAway, notes: j.notes,
    },
    plan: !family ? j.plan : j.status === 'approved' ? journeyPlanForFamily(j.plan) : null,
    requestedBy: person(j.requestedBy),
    createdAt: j.createdAt.toISOString(),
    decision: j.decidedBy && j.decidedAt && j.status !== 'waiting'
      ? { outcome: j.status, by: person(j.decidedBy), at: j.decidedAt.toISOString(), reason: family ? null : j.decisionReason }
      : null,
  };
}
