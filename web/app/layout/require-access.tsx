import { Link, Outlet, useLocation } from 'react-router-dom';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { useAppAbility } from '../../lib/ability';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';
import { canVisit, homePathFor } from '../navigation';

/** Hides pages outside the person's role; the API refuses the data behind them anyway. */
export function RequireAccess() {
  const user = useSignedInUser();
  const ability = useAppAbility();
  const { pathname } = useLocation();
  if (canVisit(pathname, user.role, ability)) return <Outlet />;
  return <NotYourWork home={homePathFor(user.role)} />;
}

function NotYourWork({ home }: { home: string }) {
  usePageTitle('Not part of your work');
  return (
    <>
      <PageHeader title="Not part of your work" />
      <EmptyState message="This page belongs to another role in the programme, so it is not open to your account.">
        <Link to={home} className="font-semibold text-brand-700 underline">
          Go to your home page
        </Link>
      </EmptyState>
    </>
  );
}
