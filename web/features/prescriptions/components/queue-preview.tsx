import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useSignOffQueue } from '../api/get-queue';
import { EMPTY_QUEUE } from './sign-off-queue';
import { ProposedFlow } from './queue-item-card';
import { timeAgo } from './waiting-since';

const PREVIEW_SIZE = 3;

/** The consultant's overview: how many are waiting and the longest waits. */
export function QueuePreview() {
  const queue = useSignOffQueue();
  if (queue.isPending) return <Spinner label="Loading the queue" />;
  if (queue.isError) return <Alert>{errorMessage(queue.error)}</Alert>;
  const { items } = queue.data;
  if (items.length === 0) return <EmptyState message={EMPTY_QUEUE} />;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-ink-700">
        <span className="text-3xl font-bold tabular-nums text-ink-900">{items.length}</span>{' '}
        {items.length === 1 ? 'proposal is' : 'proposals are'} waiting.
      </p>
      <ul className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
        {items.slice(0, PREVIEW_SIZE).map((item) => (
          <li key={item.prescriptionId} className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-0.5 px-3 py-2">
            <Link to={`/sign-off/${item.prescriptionId}`} className="font-semibold text-brand-800 underline">
              {item.infantName}
            </Link>
            <span className="text-sm">
              <ProposedFlow item={item} /> · <span className="text-ink-500">{timeAgo(item.waitingSince)}</span>
            </span>
          </li>
        ))}
      </ul>
      <Link to="/sign-off" className="font-semibold text-brand-700 underline">
        {items.length > PREVIEW_SIZE ? `Open the whole queue (${items.length})` : 'Open the sign-off queue'}
      </Link>
    </div>
  );
}
