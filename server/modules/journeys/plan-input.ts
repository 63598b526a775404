import { homeFlowsOf, type JourneyPlanInput } from '@shared/clinical/journey-plan';
import type { CreateJourneyInput } from '@shared/schemas/journeys';
import type { PolicySettings } from '@shared/schemas/policy';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { PrescriptionEntity } from '../../db/entities/prescription.entity';

/**
 * The journey conversion starts from what the baby has now: home as the origin, the active approved setting for
 * each part of the day at the purity it is given from, today's weight, and the programme's flowmeter, cannula
 * limit, pressure model and cylinder list (the same policy fields a discharge proposal uses).
 */
export function journeyPlanInputFor(infant: InfantEntity, rx: PrescriptionEntity, policy: PolicySettings, request: CreateJourneyInput): JourneyPlanInput {
  return {
    mode: request.mode,
    destinationElevationM: request.destinationElevationM ?? null,
    cabinAltitudeFt: request.cabinAltitudeFt ?? null,
    hoursAway: request.hoursAway,
    origin: infant.homeLocation,
    weightKg: infant.weightKg,
    sourceO2Percent: rx.sourceO2Percent,
    homeFlows: homeFlowsOf(rx.approvedFlowLpm ?? 0, rx.periods),
    policy,
  };
}
