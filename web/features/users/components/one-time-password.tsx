import { useState } from 'react';
import { ROLE_LABELS } from '../../../../shared/auth/roles';
import type { CreateUserResponse } from '../../../../shared/schemas/users';
import { Button } from '../../../components/ui/button';

interface OneTimePasswordProps {
  result: CreateUserResponse;
  onAddAnother: () => void;
  onDone: () => void;
}

/** The only moment the first password exists in readable form; the server keeps only its hash. */
export function OneTimePassword({ result, onAddAnother, onDone }: OneTimePasswordProps) {
  const [copied, setCopied] = useState<'idle' | 'copied' | 'failed'>('idle');
  const { user, initialPassword } = result;

  const copy = async () => {
    try {
      await navigator.clipboard.writeText(initialPassword);
      setCopied('copied');
    } catch {
      setCopied('failed');
    }
  };

  return (
    <div className="flex flex-col gap-4">
      <p className="text-ink-900">
        <span className="font-semibold">{user.name}</span> ({user.email}) was added as {ROLE_LABELS[user.role]}.
      </p>
      <div className="rounded-xl border-2 border-straw-500 bg-straw-50 p-4">
        <p className="font-semibold text-ink-900">First password</p>
        <p className="my-2 break-all font-mono text-2xl tracking-wide text-ink-900">
          {initialPassword}
        </p>
        <p className="font-semibold text-straw-900">
          This password will not be shown again. Copy it now and pass it to {user.name} in person or by phone.
        </p>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={copy}>Copy password</Button>
        <span role="status" className="text-sm text-ink-700">
          {copied === 'copied' && 'Copied to the clipboard.'}
          {copied === 'failed' && 'Copying is blocked in this browser: select the password and copy it by hand.'}
        </span>
      </div>
      <div className="flex flex-wrap gap-3 border-t border-surface-200 pt-4">
        <Button variant="secondary" onClick={onAddAnother}>
          Add another person
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Done
        </Button>
      </div>
    </div>
  );
}
