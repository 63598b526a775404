import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { formatDateTime } from '../../../lib/format';
import { usePolicyHistory } from '../api/get-policy-history';

/** Every saved version; the settings themselves stay with each version on the server. */
export function PolicyHistory({ currentVersion }: { currentVersion: number }) {
  const history = usePolicyHistory();
  return (
    <Card title="Versions">
      {history.isPending && <Spinner label="Loading the versions" />}
      {history.isError && <p className="text-ink-700">{history.error.message}</p>}
      {history.data && history.data.length === 0 && (
        <EmptyState message="No changes saved yet: the programme runs on the defaults (version 0)." />
      )}
      {history.data && history.data.length > 0 && (
        <ol aria-label="Versions, newest first" className="flex flex-col divide-y divide-surface-200">
          {history.data.map((row) => (
            <li key={row.version} className="flex flex-col gap-0.5 py-2">
              <span className="flex flex-wrap items-center gap-2 font-semibold text-ink-900">
                Version {row.version}
                {row.version === currentVersion && <Badge tone="ok">In use</Badge>}
              </span>
              <span className="text-sm text-ink-700">
                {formatDateTime(row.createdAt, 'Date not recorded')} · {row.createdBy?.name || 'Set up with the programme'}
              </span>
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
