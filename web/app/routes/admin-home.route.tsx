import { Link } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';
import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { ServiceStatus } from '../../features/health/components/service-status';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  const user = useSignedInUser();
  usePageTitle('Overview');
  return (
    <>
      <PageHeader title="Overview" intro={`Running ${user.programmeName}: accounts, programme settings and the message log.`} />
      <div className="grid gap-4 md:grid-cols-2">
        <Card title="People">
          <p className="mb-4 text-ink-700">Add staff and family accounts, and disable accounts that should no longer sign in.</p>
          <Link to="/admin/people" className={buttonClasses('secondary')}>
            Open People
          </Link>
        </Card>
        <Card title="Service status">
          <ServiceStatus />
        </Card>
        <Card title="Programme settings">
          <EmptyState message="Nothing here yet: targets, visit schedule and equipment steps will be set here." />
        </Card>
        <Card title="Message log">
          <EmptyState message="Reminders sent to families and staff will be listed here." />
        </Card>
      </div>
    </>
  );
}
