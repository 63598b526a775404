import type { InvitationResponse } from '@shared/schemas/accounts';
import { Button } from '../../../components/ui/button';

/** The same words whether the address was new or already had an account: the e-mail tells its owner which. */
export function InvitationSent({ result, onAddAnother, onDone }: { result: InvitationResponse; onAddAnother: () => void; onDone: () => void }) {
  return (
    <div className="flex flex-col gap-4">
      <p role="status" className="text-ink-900">
        An invitation is on its way to <strong className="break-all">{result.email}</strong>. They choose their own password from
        the link in it; the link works once and expires after a few days.
      </p>
      <p className="text-sm text-ink-700">
        If they already have a Nestflow account, they are told instead and nothing changes. Nobody else ever sees their password.
      </p>
      <div className="flex flex-wrap gap-3">
        <Button onClick={onAddAnother}>Add another person</Button>
        <Button variant="secondary" onClick={onDone}>Done</Button>
      </div>
    </div>
  );
}
