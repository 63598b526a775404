import { PageHeader } from '../../components/ui/page-header';
import { ConsultantOverview } from '../../features/overview/components/consultant-overview';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  usePageTitle('Overview');
  return (
    <>
      <PageHeader title="Overview" intro="Decisions waiting for you. Each figure opens the list behind it." />
      <ConsultantOverview />
    </>
  );
}
