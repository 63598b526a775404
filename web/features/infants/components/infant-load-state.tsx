import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { UseQueryResult } from '@tanstack/react-query';
import { Alert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-error';

function NoSuchBaby({ caseloadLink }: { caseloadLink: boolean }) {
  return (
    <>
      <PageHeader title="No such baby in your records" />
      <EmptyState message="This baby is not in your records. The link may be wrong, or the baby may be looked after by another team.">
        {caseloadLink && (
          <Link to="/caseload" className="font-semibold text-brand-700 underline">
            Go to the caseload
          </Link>
        )}
      </EmptyState>
    </>
  );
}

/**
 * What a page about one baby shows before it has the baby: a spinner, the not-found page (400 and 404 read the same
 * to the person: not an id, unknown, or another team's baby), or the error. Null once the baby is there.
 */
export function infantLoadFallback(infant: UseQueryResult<unknown, Error>, loadingLabel: string, caseloadLink = false): ReactNode | null {
  if (infant.isPending) return <Spinner label={loadingLabel} />;
  if (infant.isError) {
    if (isApiError(infant.error) && [400, 404].includes(infant.error.status)) return <NoSuchBaby caseloadLink={caseloadLink} />;
    return <Alert>{infant.error.message}</Alert>;
  }
  return null;
}
