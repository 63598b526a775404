import { Link } from 'react-router-dom';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { QueuePreview } from '../../features/prescriptions/components/queue-preview';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  usePageTitle('Overview');
  return (
    <>
      <PageHeader title="Overview" intro="Decisions waiting for you, and the babies in the programme." />
      <div className="grid gap-4 md:grid-cols-2">
        <Card title="Waiting for your sign-off">
          <QueuePreview />
        </Card>
        <Card title="Caseload">
          <p className="mb-2 text-ink-700">Every baby in the programme, with their status and anything flagged.</p>
          <Link to="/caseload" className="font-semibold text-brand-700 underline">
            Open the caseload
          </Link>
        </Card>
      </div>
    </>
  );
}
