import { Link } from 'react-router-dom';
import { ROLE_LABELS } from '@shared/auth/roles';
import { LogoMark } from '../../components/ui/logo-mark';
import { SignOutButton } from '../../features/session/components/sign-out-button';
import { useSignedInUser } from '../../lib/signed-in-user';
import { homePathFor } from '../navigation';

export function AppHeader() {
  const user = useSignedInUser();
  return (
    <header className="border-b border-surface-200 bg-surface-0">
      <div className="flex items-center gap-3 px-3 py-2 sm:px-6">
        <Link to={homePathFor(user.role)} className="flex min-w-0 items-center gap-2 rounded-lg">
          <LogoMark />
          <span className="min-w-0">
            <span className="block text-lg font-bold leading-tight text-brand-800">Nestflow</span>
            <span className="block truncate text-sm text-ink-500">{user.programmeName}</span>
          </span>
        </Link>
        <div className="ml-auto flex items-center gap-3">
          <p className="hidden text-right leading-tight sm:block">
            <span className="block font-semibold text-ink-900">{user.name}</span>
            <span className="block text-sm text-ink-500">{ROLE_LABELS[user.role]}</span>
          </p>
          <Link to="/account/password" className="text-sm font-semibold text-brand-700 underline">Change my password</Link>
          <SignOutButton />
        </div>
      </div>
      <p className="border-t border-surface-100 px-3 py-1 text-sm text-ink-700 sm:hidden">
        Signed in as <span className="font-semibold">{user.name}</span> · {ROLE_LABELS[user.role]}
      </p>
    </header>
  );
}
