import { Link } from 'react-router-dom';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  usePageTitle('Page not found');
  return (
    <>
      <PageHeader title="Page not found" />
      <EmptyState message="There is no page at this address. It may have moved, or the link may be mistyped.">
        <Link to="/" className="font-semibold text-brand-700 underline">
          Go to your home page
        </Link>
      </EmptyState>
    </>
  );
}
