import { useState } from 'react';
import { ORDER_FLAG_LABELS, ORDER_PURPOSE_LABELS, type EquipmentOrder } from '@shared/schemas/equipment-orders';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { formatDate, formatDateTime } from '../../../lib/format';
import { useSendOrder } from '../api/orders';
import { CancelOrderForm } from './cancel-order-form';
import { STATUS_TONES, itemLine, statusLabel } from './order-words';

export function OrderItem({ order, canManage, cylinderNames }: { order: EquipmentOrder; canManage: boolean; cylinderNames: Record<string, string> }) {
  const [cancelling, setCancelling] = useState(false);
  const send = useSendOrder(order.infantId);
  const sendable = canManage && (order.status === 'drafted' || order.status === 'failed');
  const cancellable = canManage && order.status !== 'delivered' && order.status !== 'cancelled';
  return (
    <li id={`order-${order.id}`} className="flex flex-col gap-2 px-3 py-3" aria-label={`Order ${order.reference}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
        <span className="font-semibold text-ink-900">{order.reference} · {ORDER_PURPOSE_LABELS[order.purpose]}</span>
        <Badge tone={STATUS_TONES[order.status]}>{statusLabel(order.status)}</Badge>
      </div>
      {order.flags.map((flag) => <p key={flag} className="text-sm font-semibold text-danger-800">{ORDER_FLAG_LABELS[flag]}</p>)}
      {order.failureReason && order.status === 'failed' && <p className="text-sm text-ink-700">Reason: {order.failureReason}</p>}
      {order.automaticReason && <p className="text-sm text-ink-700">Drafted by Nestflow: {order.automaticReason}</p>}
      <p className="text-sm text-ink-700">
        Needed by {formatDate(order.neededBy)}
        {order.deliveryOn && ` · delivery confirmed for ${formatDate(order.deliveryOn)}`}
        {order.deliveredAt && ` · delivered ${formatDateTime(order.deliveredAt)}`}
      </p>
      <ul className="list-disc pl-5 text-ink-900">
        {order.items.map((item, n) => <li key={n}>{itemLine(item, cylinderNames)}</li>)}
      </ul>
      <p className="whitespace-pre-line text-sm text-ink-700">{order.purpose === 'collection' ? 'Collect from' : 'Deliver to'}: {order.deliveryAddress}</p>
      <details>
        <summary className="cursor-pointer text-sm font-semibold text-brand-700">Status history of {order.reference}</summary>
        <ol className="mt-1 flex flex-col gap-1 text-sm text-ink-700">
          {order.history.map((h, n) => (
            <li key={n}>{formatDateTime(h.at)}: {statusLabel(h.status)} ({h.by}){h.note ? ` — ${h.note}` : ''}</li>
          ))}
        </ol>
      </details>
      {!cancelling && (sendable || cancellable) && (
        <div className="flex flex-wrap gap-2">
          {sendable && (
            <Button variant="secondary" size="sm" disabled={send.isPending} onClick={() => send.mutate(order.id)}>
              {send.isPending ? 'Sending…' : `Send ${order.reference} to the supplier`}
            </Button>
          )}
          {cancellable && <Button variant="quiet" size="sm" onClick={() => setCancelling(true)}>Cancel {order.reference}</Button>}
        </div>
      )}
      {cancelling && <CancelOrderForm order={order} onClose={() => setCancelling(false)} />}
    </li>
  );
}
