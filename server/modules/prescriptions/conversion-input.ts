import type { PrescriptionConversionInput } from '@shared/clinical/conversion-types';
import type { PolicySettings } from '@shared/schemas/policy';
import type { InfantEntity } from '../../db/entities/infant.entity';

/**
 * The snapshot a proposal is computed from, stored with it so the working can be re-checked later even after the
 * baby's record or the programme policy has changed.
 */
export function conversionInputFor(infant: InfantEntity, siteElevationM: number, policy: PolicySettings): PrescriptionConversionInput {
  return {
    weightKg: infant.weightKg,
    flowLpm: infant.hospitalFlowLpm,
    sourceO2Percent: infant.hospitalO2Percent,
    homeSourceO2Percent: infant.homeO2Percent,
    hospital: { elevationM: siteElevationM },
    home: infant.homeLocation,
    flowmeterStepsLpm: policy.flowmeterStepsLpm,
    cannulaMaxFlowLpm: policy.cannulaMaxFlowLpm,
    pressureModel: policy.pressureModel,
  };
}
