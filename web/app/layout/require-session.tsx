import { useMemo } from 'react';
import { AbilityProvider } from '@casl/react';
import { useQueryClient } from '@tanstack/react-query';
import { Navigate, Outlet, useLocation } from 'react-router-dom';
import type { SessionUser } from '@shared/schemas/session';
import { FullPageSpinner } from '../../components/ui/spinner';
import { useSession } from '../../features/session/api/get-session';
import { endedBySigningOut } from '../../features/session/api/end-local-session';
import { abilityForSessionUser } from '../../lib/ability';
import { SignedInUserProvider } from '../../lib/signed-in-user';

function SignedIn({ user }: { user: SessionUser }) {
  const ability = useMemo(() => abilityForSessionUser(user), [user]);
  return (
    <SignedInUserProvider user={user}>
      <AbilityProvider value={ability}>
        <Outlet />
      </AbilityProvider>
    </SignedInUserProvider>
  );
}

export function RequireSession() {
  const session = useSession();
  const location = useLocation();
  const queryClient = useQueryClient();
  if (session.isPending) return <FullPageSpinner />;
  if (session.isError) throw session.error;
  if (!session.data.user) {
    const requested = `${location.pathname}${location.search}`;
    // A session that ran out brings the person back to the page; signing out on purpose names none.
    const target = requested === '/' || endedBySigningOut(queryClient) ? '/sign-in' : `/sign-in?next=${encodeURIComponent(requested)}`;
    return <Navigate to={target} replace />;
  }
  return <SignedIn user={session.data.user} />;
}
