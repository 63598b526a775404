import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { myDaySchema } from '@shared/schemas/schedule';
import { api } from '../../../lib/api-client';
import { myDayKeys } from './my-day-keys';

export const myDayQueryOptions = () =>
  queryOptions({
    queryKey: myDayKeys.today(),
    queryFn: ({ signal }) => api.get('/api/my-day', myDaySchema, undefined, signal),
  });

export const useMyDay = () => useQuery(myDayQueryOptions());

/** A saved reading completes its check on the server; the day list must then drop it. */
export function useRefreshMyDay() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: myDayKeys.all });
}
