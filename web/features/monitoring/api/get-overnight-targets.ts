import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { policySchema, spo2TargetsSchema, withPolicyDefaults, type PolicySettings } from '@shared/schemas/policy';
import { api } from '../../../lib/api-client';
import { monitoringKeys } from './monitoring-keys';

// Only the SpO2 targets are read here, so a policy section added later cannot break these pages.
const targetsPolicySchema = z.object({
  version: policySchema.shape.version,
  settings: z.looseObject({ spo2Targets: spo2TargetsSchema }),
});

export interface OvernightTargets {
  policyVersion: number;
  /** Whole settings with the stored targets, as the shared target rule takes them. */
  settings: PolicySettings;
}

export const overnightTargetsQueryOptions = () =>
  queryOptions({
    queryKey: monitoringKeys.targets(),
    queryFn: ({ signal }) => api.get('/api/policy', targetsPolicySchema, undefined, signal),
    staleTime: 5 * 60_000,
    select: (policy): OvernightTargets => ({
      policyVersion: policy.version,
      settings: withPolicyDefaults({ spo2Targets: policy.settings.spo2Targets }),
    }),
  });

export const useOvernightTargets = () => useQuery(overnightTargetsQueryOptions());
