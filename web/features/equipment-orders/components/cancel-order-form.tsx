import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { cancelOrderSchema, type EquipmentOrder } from '@shared/schemas/equipment-orders';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useCancelOrder } from '../api/orders';

type Values = z.infer<typeof cancelOrderSchema>;

export function CancelOrderForm({ order, onClose }: { order: EquipmentOrder; onClose: () => void }) {
  const cancel = useCancelOrder(order.infantId);
  const form = useForm<Values>({ resolver: zodResolver(cancelOrderSchema), defaultValues: { reason: '' } });
  const { register, formState: { errors, submitCount }, setError } = form;
  const onSubmit = form.handleSubmit(({ reason }) =>
    cancel.mutate({ id: order.id, reason }, {
      onSuccess: onClose,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, ['reason']);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );
  const told = order.status === 'sent' || order.status === 'confirmed';
  return (
    <form onSubmit={onSubmit} noValidate aria-label={`Cancel order ${order.reference}`} className="flex flex-col gap-3">
      <ErrorSummary attempt={submitCount} failure={cancel.error} problem={formProblem(errors.root?.server?.message, cancel)} />
      <TextField label="Why it is cancelled" hint={told ? 'The supplier is e-mailed that the order is off.' : undefined}
        error={errors.reason?.message} {...register('reason')} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" disabled={cancel.isPending}>{cancel.isPending ? 'Cancelling…' : 'Cancel the order'}</Button>
        <Button variant="quiet" onClick={onClose} disabled={cancel.isPending}>Keep the order</Button>
      </div>
    </form>
  );
}
