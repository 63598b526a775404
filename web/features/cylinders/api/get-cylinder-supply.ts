import { useQuery } from '@tanstack/react-query';
import { programmePolicyQueryOptions } from '../../../lib/programme-policy';

/** The programme's cylinders and reserve, from the current policy. */
export const cylinderSupplyQueryOptions = () => programmePolicyQueryOptions((policy) => policy.settings.supply);

export const useCylinderSupply = () => useQuery(cylinderSupplyQueryOptions());
