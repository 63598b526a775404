import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { moveVisitSchema, type MoveVisitInput, type Visit } from '@shared/schemas/visits';
import { Alert } from '../../../components/ui/alert';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { CLOCK_HINT, CLOCK_INPUT } from '../../../components/ui/clock-input';
import { TextField } from '../../../components/ui/field';
import { FormActions } from '../../../components/ui/form-actions';
import { isApiError } from '../../../lib/api-error';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useMoveVisit } from '../api/move-visit';

const STALE = 'Someone changed this visit while you were editing. It has been reloaded: check it and try again.';

export function MoveVisitForm({ visit, onClose }: { visit: Visit; onClose: () => void }) {
  const move = useMoveVisit(visit);
  const form = useForm<MoveVisitInput>({
    resolver: zodResolver(moveVisitSchema),
    defaultValues: { rowVersion: visit.rowVersion, date: visit.date, time: visit.time },
  });
  const { register, formState: { errors, submitCount }, setError } = form;

  // The version is read at send time, so a try after a 409 (and the reload) starts from the fresh one.
  const onSubmit = form.handleSubmit((values) =>
    move.mutate({ ...values, rowVersion: visit.rowVersion }, {
      onSuccess: onClose,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, ['date', 'time']);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );

  const stale = isApiError(move.error) && move.error.status === 409;
  const problem = stale ? STALE : formProblem(errors.root?.server?.message, move);

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Move the visit" className="flex flex-col gap-3">
      {stale ? <Alert tone="warn">{problem}</Alert> : <ErrorSummary attempt={submitCount} failure={move.error} problem={problem} />}
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="New date" type="date" error={errors.date?.message} {...register('date')} />
        <TextField label="New time" {...CLOCK_INPUT} hint={`The family's local time, ${CLOCK_HINT}`} error={errors.time?.message} {...register('time')} />
      </div>
      <FormActions pending={move.isPending} submitLabel="Move the visit" pendingLabel="Moving…" onCancel={onClose} cancelLabel="Keep the visit as it is" />
    </form>
  );
}
