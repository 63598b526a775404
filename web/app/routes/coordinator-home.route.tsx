import { Link } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { CoordinatorOverview } from '../../features/overview/components/coordinator-overview';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  usePageTitle('Overview');
  return (
    <>
      <PageHeader title="Overview" intro="What needs doing in the programme today. Each figure opens the list behind it."
        actions={<Link to="/enrol" className={buttonClasses('secondary')}>Enrol a baby</Link>} />
      <CoordinatorOverview />
    </>
  );
}
