import { useState } from 'react';
import type { User } from '@shared/schemas/users';
import { Button } from '../../../components/ui/button';
import { useAppAbility } from '../../../lib/ability';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { useSendSetupLink } from '../api/send-setup-link';

/** "Send a new set-up link", confirmed first because it signs the person out and ends their current password. */
export function SetupLinkAction({ user }: { user: User }) {
  const me = useSignedInUser();
  const ability = useAppAbility();
  const send = useSendSetupLink();
  const [confirming, setConfirming] = useState(false);

  if (!ability.can('update', 'User') || user.id === me.id || user.disabled) return null;
  const label = user.passwordSet ? 'New set-up link' : 'Resend invitation';
  if (!confirming) {
    return (
      <Button size="sm" variant="secondary" onClick={() => setConfirming(true)} aria-label={`${label} for ${user.name}`}>
        {label}
      </Button>
    );
  }
  const question = user.passwordSet
    ? `E-mail ${user.name} a new set-up link? Their password stops working and they are signed out everywhere.`
    : `E-mail ${user.name} a fresh invitation link? The earlier link stops working.`;
  return (
    <div role="group" aria-label={`Confirm: ${label.toLowerCase()} for ${user.name}`} className="flex flex-wrap items-center gap-2">
      <span className="text-sm text-ink-900">{question}</span>
      <Button size="sm" variant="danger" disabled={send.isPending} onClick={() => send.mutate(user.id, { onSettled: () => setConfirming(false) })}>
        {send.isPending ? 'Sending…' : 'Yes, send it'}
      </Button>
      <Button size="sm" variant="quiet" disabled={send.isPending} onClick={() => setConfirming(false)}>
        Cancel
      </Button>
    </div>
  );
}
