import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { usePolicy } from '../../policy/api/get-policy';
import { useInfantOrders } from '../api/orders';
import { CreateOrderForm } from './create-order-form';
import { OrderItem } from './order-item';

const listClasses = 'flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200';

/** Orders to the oxygen supplier for this baby: what was asked, where each stands, and who changed it. */
export function EquipmentSection({ infantId, familyAddress, canManage }: { infantId: string; familyAddress: string; canManage: boolean }) {
  const orders = useInfantOrders(infantId);
  const policy = usePolicy();
  const [ordering, setOrdering] = useState(false);
  const settings = policy.data?.settings;
  const cylinderNames = Object.fromEntries((settings?.supply.cylinders ?? []).map((c) => [c.id, c.name]));
  const items = orders.data?.items ?? [];
  const open = items.filter((o) => o.status !== 'delivered' && o.status !== 'cancelled');
  const closed = items.filter((o) => o.status === 'delivered' || o.status === 'cancelled');
  const action = canManage && !ordering && settings ? <Button variant="secondary" size="sm" onClick={() => setOrdering(true)}>Order equipment</Button> : undefined;
  return (
    <Card title="Equipment" actions={action}>
      <div className="flex flex-col gap-4">
        {canManage && settings && !settings.supplier.orderEmail && (
          <Alert tone="warn">The programme settings have no supplier order address yet: orders can be drafted but not sent.</Alert>
        )}
        {ordering && settings && (
          <CreateOrderForm infantId={infantId} familyAddress={familyAddress} cylinders={settings.supply.cylinders}
            lendsOximeter={settings.supplier.lendsOximeter} onClose={() => setOrdering(false)} />
        )}
        {orders.isPending && <Spinner label="Loading equipment orders" />}
        {orders.isError && <Alert>{orders.error.message}</Alert>}
        {orders.data && items.length === 0 && <EmptyState message="No equipment ordered yet." />}
        {open.length > 0 && (
          <ul aria-label="Open equipment orders" className={listClasses}>
            {open.map((o) => <OrderItem key={o.id} order={o} canManage={canManage} cylinderNames={cylinderNames} />)}
          </ul>
        )}
        {closed.length > 0 && (
          <details>
            <summary className="cursor-pointer font-semibold text-brand-700">Delivered and cancelled orders ({closed.length})</summary>
            <ul aria-label="Delivered and cancelled orders" className={`mt-2 ${listClasses}`}>
              {closed.map((o) => <OrderItem key={o.id} order={o} canManage={false} cylinderNames={cylinderNames} />)}
            </ul>
          </details>
        )}
      </div>
    </Card>
  );
}
