import { Button } from '../../../components/ui/button';
import { useSignOut } from '../api/sign-out';

export function SignOutButton() {
  const signOut = useSignOut();
  return (
    <Button variant="secondary" size="sm" onClick={() => signOut.mutate()} disabled={signOut.isPending}>
      {signOut.isPending ? 'Signing out…' : 'Sign out'}
    </Button>
  );
}
