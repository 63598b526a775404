import { Navigate, useSearchParams } from 'react-router-dom';
import { LogoMark } from '../../components/ui/logo-mark';
import { PageHeading } from '../../components/ui/page-heading';
import { FullPageSpinner } from '../../components/ui/spinner';
import { useSession } from '../../features/session/api/get-session';
import { SignInForm } from '../../features/session/components/sign-in-form';
import { abilityForSessionUser } from '../../lib/ability';
import { landingPathFor } from '../navigation';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  const session = useSession();
  const [params] = useSearchParams();
  usePageTitle('Sign in');
  if (session.isPending) return <FullPageSpinner />;
  if (session.isError) throw session.error;

  const user = session.data.user;
  if (user) {
    // Reached both by a signed-in visit and right after a successful sign-in.
    return <Navigate to={landingPathFor(user.role, abilityForSessionUser(user), params.get('next'))} replace />;
  }

  return (
    <main className="flex min-h-dvh items-center justify-center px-4 py-10">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-3">
          <LogoMark className="size-12" />
          <div>
            <p className="text-2xl font-bold text-brand-800">Nestflow</p>
            <p className="text-ink-500">Home oxygen programme</p>
          </div>
        </div>
        <section className="rounded-2xl border border-surface-200 bg-surface-0 p-6 shadow-sm">
          <PageHeading className="mb-4 text-xl font-bold text-ink-900">Sign in</PageHeading>
          {params.get('passwordSet') && <p role="status" className="mb-4 text-ok-800">Your password is saved. Sign in with it now.</p>}
          <SignInForm />
        </section>
      </div>
    </main>
  );
}
