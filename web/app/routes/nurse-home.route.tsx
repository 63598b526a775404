import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';

export function Component() {
  return (
    <>
      <PageHeader title="My day" intro="Today's home visits and the oximetry checks that are due on your caseload." />
      <div className="grid gap-4 md:grid-cols-2">
        <Card title="Today's visits">
          <EmptyState message="No visits booked for today." />
        </Card>
        <Card title="Checks due">
          <EmptyState message="Spot checks and overnight studies that fall due will appear here." />
        </Card>
      </div>
    </>
  );
}
