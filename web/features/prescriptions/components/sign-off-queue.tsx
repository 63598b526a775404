import { Alert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useSignOffQueue } from '../api/get-queue';
import { QueueItemCard } from './queue-item-card';

export const EMPTY_QUEUE = 'Nothing is waiting for your sign-off.';

/** The server sends the queue oldest first; the order is kept so the longest wait is always at the top. */
export function SignOffQueue() {
  const queue = useSignOffQueue();
  if (queue.isPending) return <Spinner label="Loading the queue" />;
  if (queue.isError) return <Alert>{errorMessage(queue.error)}</Alert>;
  if (queue.data.items.length === 0) return <EmptyState message={EMPTY_QUEUE} />;
  return (
    <ol aria-label="Waiting for sign-off, oldest first" className="grid gap-3 lg:grid-cols-2">
      {queue.data.items.map((item) => (
        <li key={item.prescriptionId}>
          <QueueItemCard item={item} />
        </li>
      ))}
    </ol>
  );
}
