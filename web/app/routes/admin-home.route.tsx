import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { ServiceStatus } from '../../features/health/components/service-status';
import { ChainCard } from '../../features/audit/components/chain-card';
import { AdminOverview } from '../../features/overview/components/admin-overview';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  const user = useSignedInUser();
  usePageTitle('Overview');
  return (
    <>
      <PageHeader title="Overview" intro={`Running ${user.programmeName}: accounts, programme settings and messages. Each figure opens the list behind it.`} />
      <AdminOverview />
      {/* Apart from the figures, so it still answers when the database behind them does not. */}
      <div className="mt-4 grid gap-4 lg:grid-cols-2">
        <Card title="Service status">
          <ServiceStatus />
        </Card>
        <ChainCard />
      </div>
    </>
  );
}
