import { Badge } from '../../../components/ui/badge';
import { Spinner } from '../../../components/ui/spinner';
import { useHealth } from '../api/get-health';

function Part({ label, ok, words }: { label: string; ok: boolean; words: string }) {
  return (
    <li className="flex items-center justify-between gap-3 py-2">
      <span>{label}</span>
      <Badge tone={ok ? 'ok' : 'danger'}>{words}</Badge>
    </li>
  );
}

export function ServiceStatus() {
  const health = useHealth();
  if (health.isPending) return <Spinner label="Checking" />;
  if (health.isError) return <p className="text-danger-800">The status check did not answer: {health.error.message}</p>;
  return (
    <ul className="divide-y divide-surface-200">
      <Part label="Database" ok={health.data.db === 'ok'} words={health.data.db === 'ok' ? 'Working' : 'Not reachable'} />
      <Part label="Job queue" ok={health.data.redis === 'ok'} words={health.data.redis === 'ok' ? 'Working' : 'Not reachable'} />
      <Part
        label="Background worker (reminders, analyses)"
        ok={health.data.workers.status === 'ok'}
        words={health.data.workers.status === 'ok' ? `Working (${health.data.workers.running})` : 'Not heard from for over a minute'}
      />
    </ul>
  );
}
