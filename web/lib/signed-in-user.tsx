import { createContext, use, type ReactNode } from 'react';
import type { SessionUser } from '@shared/schemas/session';

const SignedInUserContext = createContext<SessionUser | null>(null);

export function SignedInUserProvider({ user, children }: { user: SessionUser; children: ReactNode }) {
  return <SignedInUserContext value={user}>{children}</SignedInUserContext>;
}

/** Only valid below the session guard, which renders nothing for a signed-out visitor. */
export function useSignedInUser(): SessionUser {
  const user = use(SignedInUserContext);
  if (!user) throw new Error('useSignedInUser is only available inside the signed-in shell');
  return user;
}
