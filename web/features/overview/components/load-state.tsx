import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';

/** Loading, failure, and the answer for another role (a stale session): each in words, never an empty page. */
export function OverviewLoadState<T>({ query, children }: { query: UseQueryResult<T | null>; children: (data: T) => ReactNode }) {
  if (query.isPending) return <Spinner label="Loading the figures" />;
  if (query.isError) return <Alert>{errorMessage(query.error)}</Alert>;
  if (!query.data) return <Alert tone="warn">These figures belong to another role. Sign out and in again to see your own.</Alert>;
  return <>{children(query.data)}</>;
}
