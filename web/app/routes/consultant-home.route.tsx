import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';

export function Component() {
  return (
    <>
      <PageHeader title="Overview" intro="Decisions waiting for you, and the babies in the programme." />
      <div className="grid gap-4 md:grid-cols-2">
        <Card title="Waiting for your sign-off">
          <EmptyState message="Nothing is waiting for sign-off." />
        </Card>
        <Card title="Caseload">
          <EmptyState message="Nothing here yet: enrolled babies will appear here." />
        </Card>
      </div>
    </>
  );
}
