import type { Message } from '../../../../shared/schemas/messages';
import { Button } from '../../../components/ui/button';
import { useRetryMessage } from '../api/retry-message';

/** Only a failed message can be sent again; the server checks the state once more before it queues it. */
export function RetryMessageAction({ message }: { message: Message }) {
  const retry = useRetryMessage();
  if (message.status !== 'failed') return null;
  return (
    <Button size="sm" variant="secondary" disabled={retry.isPending} onClick={() => retry.mutate(message.id)}
      aria-label={`${retry.isPending ? 'Sending…' : 'Send again'} to ${message.recipient.name}`}>
      {retry.isPending ? 'Sending…' : 'Send again'}
    </Button>
  );
}
