import { useState } from 'react';
import type { User } from '@shared/schemas/users';
import { Button } from '../../../components/ui/button';
import { useAppAbility } from '../../../lib/ability';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { useSetUserAccess } from '../api/set-user-access';

export function UserAccessAction({ user }: { user: User }) {
  const me = useSignedInUser();
  const ability = useAppAbility();
  const access = useSetUserAccess();
  const [confirming, setConfirming] = useState(false);

  if (!ability.can('disable', 'User')) return null;
  // The server refuses self-disable too; not offering it avoids an admin locking the programme out.
  if (user.id === me.id) return <span className="text-sm text-ink-500">Your account</span>;

  const verb = user.disabled ? 'Enable' : 'Disable';
  if (!confirming) {
    return (
      <Button size="sm" variant="secondary" onClick={() => setConfirming(true)} aria-label={`${verb} ${user.name}`}>
        {verb}
      </Button>
    );
  }

  const question = user.disabled
    ? `Let ${user.name} sign in again?`
    : `Disable ${user.name}? They are signed out everywhere at once.`;
  return (
    <div role="group" aria-label={`Confirm: ${verb.toLowerCase()} ${user.name}`} className="flex flex-wrap items-center gap-2">
      <span className="text-sm text-ink-900">{question}</span>
      <Button
        size="sm"
        variant={user.disabled ? 'primary' : 'danger'}
        disabled={access.isPending}
        onClick={() => access.mutate({ id: user.id, disable: !user.disabled }, { onSettled: () => setConfirming(false) })}
      >
        {access.isPending ? 'Saving…' : `Yes, ${verb.toLowerCase()}`}
      </Button>
      <Button size="sm" variant="quiet" disabled={access.isPending} onClick={() => setConfirming(false)}>
        Cancel
      </Button>
    </div>
  );
}
