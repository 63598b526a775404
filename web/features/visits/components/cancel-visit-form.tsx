import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { cancelVisitSchema, type Visit } from '@shared/schemas/visits';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useCancelVisit } from '../api/cancel-visit';

type Values = z.infer<typeof cancelVisitSchema>;

export function CancelVisitForm({ visit, onClose }: { visit: Visit; onClose: () => void }) {
  const cancel = useCancelVisit(visit);
  const form = useForm<Values>({ resolver: zodResolver(cancelVisitSchema), defaultValues: { reason: '' } });
  const { register, formState: { errors, submitCount }, setError } = form;

  const onSubmit = form.handleSubmit(({ reason }) =>
    cancel.mutate(reason, {
      onSuccess: onClose,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, ['reason']);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );

  const problem = formProblem(errors.root?.server?.message, cancel);

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Cancel the visit" className="flex flex-col gap-3">
      <ErrorSummary attempt={submitCount} failure={cancel.error} problem={problem} />
      <TextField label="Why it is cancelled" error={errors.reason?.message} {...register('reason')} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" disabled={cancel.isPending}>{cancel.isPending ? 'Cancelling…' : 'Cancel the visit'}</Button>
        <Button variant="quiet" onClick={onClose} disabled={cancel.isPending}>Keep the visit as it is</Button>
      </div>
    </form>
  );
}
