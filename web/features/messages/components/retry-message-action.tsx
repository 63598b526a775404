import type { Message } from '../../../../shared/schemas/messages';
import { Button } from '../../../components/ui/button';
import { useRetryMessage } from '../api/retry-message';

/**
 * A failed message, or one whose outcome is unknown (after the coordinator has checked with the family), can be
 * sent again; the server checks the state once more before it queues it.
 */
export function RetryMessageAction({ message }: { message: Message }) {
  const retry = useRetryMessage();
  if (message.status !== 'failed' && message.status !== 'unknown') return null;
  return (
    <Button size="sm" variant="secondary" disabled={retry.isPending} onClick={() => retry.mutate(message.id)}
      aria-label={`Send again to ${message.recipient.name}`}>
      {retry.isPending ? 'Sending…' : 'Send again'}
    </Button>
  );
}
