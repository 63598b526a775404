import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { ORDER_PURPOSE_LABELS, supplierConfirmSchema, type SupplierOrderView } from '@shared/schemas/equipment-orders';
import { Button } from '../../../components/ui/button';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { TextField } from '../../../components/ui/field';
import { SavedNote } from '../../../components/ui/saved-note';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { formatDate, formatDateTime } from '../../../lib/format';
import { useSupplierAction } from '../api/supplier-order';

const STATUS_WORDS: Record<SupplierOrderView['status'], string> = {
  drafted: 'Not sent yet', failed: 'Not sent yet', sent: 'Waiting for your delivery date', confirmed: 'Delivery date confirmed',
  delivered: 'Delivered', cancelled: 'Cancelled: please do not deliver',
};

function ConfirmForm({ token, order }: { token: string; order: SupplierOrderView }) {
  const { confirm } = useSupplierAction(token);
  const form = useForm<z.infer<typeof supplierConfirmSchema>>({ resolver: zodResolver(supplierConfirmSchema), defaultValues: { deliveryOn: order.deliveryOn ?? '' } });
  const { register, formState: { errors, submitCount }, setError } = form;
  const onSubmit = form.handleSubmit(({ deliveryOn }) => confirm.mutate(deliveryOn, {
    onError: (error) => {
      const leftover = applyServerFieldErrors(error, setError, ['deliveryOn']);
      if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
    },
  }));
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Confirm the delivery date" className="flex flex-col gap-3">
      <ErrorSummary attempt={submitCount} failure={confirm.error} problem={formProblem(errors.root?.server?.message, confirm)} />
      <TextField label="Delivery date" type="date" hint={`Needed by ${formatDate(order.neededBy)}`} error={errors.deliveryOn?.message} {...register('deliveryOn')} />
      <Button type="submit" disabled={confirm.isPending}>{confirm.isPending ? 'Saving…' : order.deliveryOn ? 'Change the delivery date' : 'Confirm the delivery date'}</Button>
      {confirm.isSuccess && <SavedNote key={confirm.submittedAt}>Delivery date saved: {formatDate(confirm.data.deliveryOn)}.</SavedNote>}
    </form>
  );
}

/** What the supplier needs to deliver, and the two things they can do: confirm a date, record the delivery. */
export function SupplierOrderPanel({ token, order }: { token: string; order: SupplierOrderView }) {
  const { delivered } = useSupplierAction(token);
  const collection = order.purpose === 'collection';
  return (
    <div className="flex flex-col gap-5">
      <p className="text-lg font-semibold text-ink-900">{STATUS_WORDS[order.status]}</p>
      <dl className="grid grid-cols-1 gap-x-4 gap-y-2 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold text-ink-700">Order</dt><dd>{order.reference} · {ORDER_PURPOSE_LABELS[order.purpose]} · {order.programme.name}</dd>
        <dt className="font-semibold text-ink-700">Needed by</dt><dd>{formatDate(order.neededBy)}</dd>
        <dt className="font-semibold text-ink-700">{collection ? 'Collect from' : 'Deliver to'}</dt>
        <dd className="whitespace-pre-line">{order.recipient}{'\n'}{order.deliveryAddress}</dd>
        {order.deliveryOn && <><dt className="font-semibold text-ink-700">Delivery date</dt><dd>{formatDate(order.deliveryOn)}</dd></>}
        {order.deliveredAt && <><dt className="font-semibold text-ink-700">Delivered</dt><dd>{formatDateTime(order.deliveredAt)}</dd></>}
      </dl>
      <section aria-labelledby="supplier-items" className="flex flex-col gap-2">
        <h2 id="supplier-items" className="text-lg font-bold text-ink-900">{collection ? 'Equipment to collect' : 'Equipment'}</h2>
        <ul className="list-disc pl-5">
          {order.items.map((item, n) => (
            <li key={n}>{item.quantity} × {item.label}{item.detail ? `, ${item.detail}` : ''}{item.note ? ` (${item.note})` : ''}</li>
          ))}
        </ul>
        {order.note && <p className="whitespace-pre-line">{order.note}</p>}
      </section>
      {(order.status === 'sent' || order.status === 'confirmed') && (
        <section aria-labelledby="supplier-date" className="flex flex-col gap-3">
          <h2 id="supplier-date" className="text-lg font-bold text-ink-900">{collection ? 'When you will collect' : 'When you will deliver'}</h2>
          <ConfirmForm token={token} order={order} />
        </section>
      )}
      {order.status === 'confirmed' && (
        <section aria-labelledby="supplier-done" className="flex flex-col gap-3">
          <h2 id="supplier-done" className="text-lg font-bold text-ink-900">When it is done</h2>
          {delivered.isError && <p role="alert" className="font-semibold text-danger-800">{delivered.error.message}</p>}
          <Button variant="secondary" disabled={delivered.isPending} onClick={() => delivered.mutate()}>
            {delivered.isPending ? 'Saving…' : collection ? 'Mark as collected' : 'Mark as delivered'}
          </Button>
        </section>
      )}
      {order.programme.phone && (
        <p>Questions about this order: call {order.programme.name} on{' '}
          <a className="font-semibold text-brand-700 underline" href={`tel:${order.programme.phoneDial ?? ''}`}>{order.programme.phone}</a>.</p>
      )}
      <p className="text-sm text-ink-700">This link works for this order only, until {formatDateTime(order.linkExpiresAt)}.</p>
    </div>
  );
}
