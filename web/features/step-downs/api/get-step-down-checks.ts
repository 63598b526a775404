import { queryOptions, useQuery } from '@tanstack/react-query';
import { stepDownPreviewSchema } from '@shared/schemas/step-downs';
import { api } from '../../../lib/api-client';

export const stepDownKeys = {
  all: ['step-downs'] as const,
  checks: (infantId: string) => [...stepDownKeys.all, 'checks', infantId] as const,
};

/** The rules as the server checks them now, so the nurse sees each one before sending. */
export const stepDownChecksQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: stepDownKeys.checks(infantId),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(infantId)}/step-down-checks`, stepDownPreviewSchema, undefined, signal),
    staleTime: 0,
  });

export const useStepDownChecks = (infantId: string, enabled: boolean) => useQuery({ ...stepDownChecksQueryOptions(infantId), enabled });
