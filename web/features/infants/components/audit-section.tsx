import { Alert } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { formatDateTime } from '../../../lib/format';
import { useInfantAudit } from '../api/get-infant-audit';
import { auditText } from './audit-text';
import { ScrollRegion } from '../../../components/ui/scroll-region';

interface AuditSectionProps {
  infantId: string;
  /** Changes when a version is added or changes state, e.g. "2-proposed", so the trail follows the worker. */
  versionsState: string;
}

export function AuditSection({ infantId, versionsState }: AuditSectionProps) {
  const audit = useInfantAudit(infantId, versionsState);
  return (
    <Card title="Audit trail">
      {audit.isPending && <Spinner label="Loading the audit trail" />}
      {audit.isError && <Alert>{audit.error.message}</Alert>}
      {audit.data && audit.data.items.length === 0 && <EmptyState message="Nothing recorded yet." />}
      {audit.data && audit.data.items.length > 0 && (
        <ScrollRegion label="Changes to this record, newest first" className="relative overflow-x-auto">
          <table className="w-full border-collapse text-left text-sm">
            <caption className="sr-only">Changes to this record, newest first</caption>
            <thead className="bg-surface-100 text-ink-700">
              <tr>
                <th scope="col" className="px-3 py-2 font-semibold">When</th>
                <th scope="col" className="px-3 py-2 font-semibold">Who</th>
                <th scope="col" className="px-3 py-2 font-semibold">What</th>
              </tr>
            </thead>
            <tbody>
              {audit.data.items.map((event) => (
                <tr key={event.id} className="border-t border-surface-200 align-top">
                  <td className="whitespace-nowrap px-3 py-2 text-ink-700">{formatDateTime(event.at)}</td>
                  <td className="px-3 py-2 text-ink-900">{event.actor?.name || 'Nestflow (automatic)'}</td>
                  <td className="px-3 py-2 text-ink-900">{auditText(event, audit.data.people)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </ScrollRegion>
      )}
    </Card>
  );
}
