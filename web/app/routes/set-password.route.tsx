import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { LogoMark } from '../../components/ui/logo-mark';
import { Spinner } from '../../components/ui/spinner';
import { useSetupLink } from '../../features/account/api/check-setup-link';
import { SetPasswordForm } from '../../features/account/components/set-password-form';
import { errorMessage } from '../../lib/api-error';

/** Opened from the invitation or set-up e-mail, signed out. */
export function Component() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const token = params.get('token') ?? '';
  const link = useSetupLink(token);

  let body;
  if (!token) body = <Alert>This page needs the link from your e-mail. Open the link again, or ask your programme admin for a new one.</Alert>;
  else if (link.isPending) body = <Spinner label="Checking your link" />;
  else if (link.isError) body = <Alert>{errorMessage(link.error)}</Alert>;
  else body = <SetPasswordForm token={token} info={link.data} onDone={() => navigate('/sign-in?passwordSet=1', { replace: true })} />;

  return (
    <main className="flex min-h-dvh items-center justify-center px-4 py-10">
      <div className="w-full max-w-md">
        <div className="mb-6 flex items-center gap-3">
          <LogoMark className="size-12" />
          <p className="text-2xl font-bold text-brand-800">Nestflow</p>
        </div>
        <section className="flex flex-col gap-4 rounded-2xl border border-surface-200 bg-surface-0 p-6 shadow-sm">
          <h1 className="text-xl font-bold text-ink-900">Choose your password</h1>
          {body}
          <Link to="/sign-in" className="text-sm font-semibold text-brand-700 underline">Go to sign in</Link>
        </section>
      </div>
    </main>
  );
}
