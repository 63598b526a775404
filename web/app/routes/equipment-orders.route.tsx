import { Link, useSearchParams } from 'react-router-dom';
import { ORDER_FLAG_LABELS, ORDER_PURPOSE_LABELS, ORDER_STATUSES, ORDER_STATUS_LABELS } from '@shared/schemas/equipment-orders';
import { Alert } from '../../components/ui/alert';
import { Badge } from '../../components/ui/badge';
import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { SelectField } from '../../components/ui/field';
import { PageHeader } from '../../components/ui/page-header';
import { ScrollRegion } from '../../components/ui/scroll-region';
import { Spinner } from '../../components/ui/spinner';
import { useProgrammeOrders } from '../../features/equipment-orders/api/orders';
import { STATUS_TONES } from '../../features/equipment-orders/components/order-words';
import { formatDate } from '../../lib/format';
import { usePageTitle } from '../../lib/page-title';

const FILTERS: Array<[string, string]> = [['', 'All orders'], ['open', 'Open (not delivered or cancelled)'], ['overdue', 'Not confirmed by the date needed'],
  ...ORDER_STATUSES.map((s): [string, string] => [s, ORDER_STATUS_LABELS[s]])];

/** The programme's orders to the supplier, newest first; flags say which need the coordinator. */
export function Component() {
  usePageTitle('Equipment orders');
  const [params, setParams] = useSearchParams();
  const status = params.get('status') ?? '';
  const after = params.get('after') ?? '';
  const orders = useProgrammeOrders(status, after);
  const items = orders.data?.items ?? [];
  return (
    <>
      <PageHeader title="Equipment orders" />
      <Card title="Orders to the supplier">
        <div className="flex flex-col gap-4">
          <SelectField label="Show" value={status} onChange={(e) => setParams(e.target.value ? { status: e.target.value } : {})}>
            {FILTERS.map(([value, label]) => <option key={value} value={value}>{label}</option>)}
          </SelectField>
          {orders.isPending && <Spinner label="Loading orders" />}
          {orders.isError && <Alert>{orders.error.message}</Alert>}
          {orders.data && items.length === 0 && <EmptyState message="No orders here." />}
          {items.length > 0 && (
            <ScrollRegion label="Equipment orders">
              <table className="w-full text-left">
                <thead>
                  <tr className="border-b border-surface-200 text-sm text-ink-700">
                    <th scope="col" className="py-2 pr-3">Order</th><th scope="col" className="py-2 pr-3">Baby</th>
                    <th scope="col" className="py-2 pr-3">Needed by</th><th scope="col" className="py-2 pr-3">Status</th>
                  </tr>
                </thead>
                <tbody>
                  {items.map((o) => (
                    <tr key={o.id} className="border-b border-surface-100 align-top">
                      <td className="py-2 pr-3">{o.reference}<br /><span className="text-sm text-ink-700">{ORDER_PURPOSE_LABELS[o.purpose]}</span></td>
                      <td className="py-2 pr-3"><Link className="font-semibold text-brand-800 underline" to={`/infants/${o.infantId}`}>{o.infantName}</Link></td>
                      <td className="py-2 pr-3">{formatDate(o.neededBy)}{o.deliveryOn && <><br /><span className="text-sm text-ink-700">delivery {formatDate(o.deliveryOn)}</span></>}</td>
                      <td className="py-2 pr-3">
                        <Badge tone={STATUS_TONES[o.status]}>{ORDER_STATUS_LABELS[o.status]}</Badge>
                        {o.flags.map((f) => <p key={f} className="text-sm font-semibold text-danger-800">{ORDER_FLAG_LABELS[f]}</p>)}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </ScrollRegion>
          )}
          <div className="flex gap-3">
            {after && <Link className="font-semibold text-brand-700 underline" to={status ? `?status=${status}` : '?'}>First page</Link>}
            {orders.data?.next && (
              <Link className="font-semibold text-brand-700 underline" to={`?${new URLSearchParams({ ...(status ? { status } : {}), after: orders.data.next })}`}>Next page</Link>
            )}
          </div>
        </div>
      </Card>
    </>
  );
}
