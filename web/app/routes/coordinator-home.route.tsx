import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  usePageTitle('Overview');
  return (
    <>
      <PageHeader title="Overview" intro="Babies in your programme, visits to book and journeys to arrange." />
      <div className="grid gap-4 md:grid-cols-2">
        <Card title="Caseload" className="md:col-span-2">
          <EmptyState message="Nothing here yet: enrolled babies will appear here." />
        </Card>
        <Card title="Visits to book">
          <EmptyState message="Visits that need a date will appear here." />
        </Card>
        <Card title="Journeys to arrange">
          <EmptyState message="Journey checks asked for by families will appear here." />
        </Card>
      </div>
    </>
  );
}
