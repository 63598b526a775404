import { useParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { LogoMark } from '../../components/ui/logo-mark';
import { PageHeading } from '../../components/ui/page-heading';
import { Spinner } from '../../components/ui/spinner';
import { useSupplierOrder } from '../../features/equipment-orders/api/supplier-order';
import { SupplierOrderPanel } from '../../features/equipment-orders/components/supplier-order-view';
import { errorMessage } from '../../lib/api-error';
import { usePageTitle } from '../../lib/page-title';

/** Opened by the oxygen supplier from the order e-mail, with no account: the signed link is all it needs. */
export function Component() {
  const { token = '' } = useParams();
  const order = useSupplierOrder(token);
  usePageTitle(order.data ? `Order ${order.data.reference}` : 'Equipment order');

  let body;
  if (order.isPending) body = <Spinner label="Loading the order" />;
  else if (order.isError) body = <Alert>{errorMessage(order.error)}</Alert>;
  else body = <SupplierOrderPanel token={token} order={order.data} />;

  return (
    <main className="flex min-h-dvh justify-center px-4 py-8">
      <div className="flex w-full max-w-xl flex-col gap-6">
        <div className="flex items-center gap-3">
          <LogoMark className="size-10" />
          <p className="text-xl font-bold text-brand-800">Nestflow</p>
        </div>
        <section className="flex flex-col gap-4 rounded-2xl border border-surface-200 bg-surface-0 p-5 shadow-sm">
          <PageHeading className="text-2xl font-bold text-ink-900">{order.data ? `Equipment order ${order.data.reference}` : 'Equipment order'}</PageHeading>
          {body}
        </section>
      </div>
    </main>
  );
}
