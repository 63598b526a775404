import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { auditEventsSchema } from '@shared/schemas/infants';
import { api } from '../../../lib/api-client';
import { infantKeys } from './infant-keys';

export { auditEventSchema, type AuditEvent } from '@shared/schemas/infants';

export const infantAuditQueryOptions = (infantId: string, versionsState: string) =>
  queryOptions({
    queryKey: infantKeys.auditAt(infantId, versionsState),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(infantId)}/audit`, auditEventsSchema, undefined, signal),
    placeholderData: keepPreviousData,
  });

export const useInfantAudit = (infantId: string, versionsState: string) =>
  useQuery(infantAuditQueryOptions(infantId, versionsState));
