import { Badge } from '../../../components/ui/badge';
import { Spinner } from '../../../components/ui/spinner';
import { useHealth } from '../api/get-health';

function Part({ label, state }: { label: string; state: 'ok' | 'down' }) {
  return (
    <li className="flex items-center justify-between gap-3 py-2">
      <span>{label}</span>
      <Badge tone={state === 'ok' ? 'ok' : 'danger'}>{state === 'ok' ? 'Working' : 'Not reachable'}</Badge>
    </li>
  );
}

export function ServiceStatus() {
  const health = useHealth();
  if (health.isPending) return <Spinner label="Checking" />;
  if (health.isError) return <p className="text-danger-800">The status check did not answer: {health.error.message}</p>;
  return (
    <ul className="divide-y divide-surface-200">
      <Part label="Database" state={health.data.db} />
      <Part label="Job queue" state={health.data.redis} />
    </ul>
  );
}
