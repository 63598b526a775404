import type { Message } from '@shared/schemas/messages';
import { Button } from '../../../components/ui/button';
import { useConfirmArrived } from '../api/confirm-arrived';
import { useRetryMessage } from '../api/retry-message';

/**
 * A failed message, or one whose outcome is unknown (after the coordinator has checked with the family), can be
 * sent again; the server checks the state once more before it queues it.
 */
export function RetryMessageAction({ message }: { message: Message }) {
  const retry = useRetryMessage();
  const arrived = useConfirmArrived();
  if (message.status !== 'failed' && message.status !== 'unknown') return null;
  const again = (
    <Button size="sm" variant="secondary" disabled={retry.isPending || arrived.isPending} onClick={() => retry.mutate(message.id)}
      aria-label={`${retry.isPending ? 'Sending…' : 'Send again'} to ${message.recipient.name}`}>
      {retry.isPending ? 'Sending…' : 'Send again'}
    </Button>
  );
  if (message.status === 'failed') return again;
  // Unknown outcome: the coordinator asks the family first, then records what they said.
  return (
    <span className="flex flex-wrap gap-2">
      <Button size="sm" variant="secondary" disabled={retry.isPending || arrived.isPending} onClick={() => arrived.mutate(message.id)}
        aria-label={`${arrived.isPending ? "Saving…" : "It arrived"}: ${message.recipient.name}`}>
        {arrived.isPending ? 'Saving…' : 'It arrived'}
      </Button>
      {again}
    </span>
  );
}
