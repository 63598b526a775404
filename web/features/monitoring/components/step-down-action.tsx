import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { Prescription } from '../../../../shared/schemas/prescriptions';
import { stepDownRequestSchema, type StepDownRequestInput } from '../../../../shared/schemas/step-downs';
import { Alert } from '../../../components/ui/alert';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { describedBy } from '../../../components/ui/field';
import { isApiError } from '../../../lib/api-error';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useRequestStepDown } from '../api/request-step-down';

interface StepDownActionProps {
  infantId: string;
  /** A proposal already waits for sign-off, so another request would be refused. */
  waiting: boolean;
  onRequested: (rx: Prescription) => void;
}

function StepDownForm({ infantId, onRequested, onClose }: Omit<StepDownActionProps, 'waiting'> & { onClose: () => void }) {
  const id = useId();
  const request = useRequestStepDown(infantId, onRequested);
  const { register, handleSubmit, setError, formState: { errors, submitCount } } = useForm<StepDownRequestInput>({
    resolver: zodResolver(stepDownRequestSchema),
    defaultValues: { reason: '' },
  });
  const onSubmit = handleSubmit((input) =>
    request.mutate(input, {
      onSuccess: onClose,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, ['reason']);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );
  const conflict = isApiError(request.error) && request.error.status === 409;
  const problem = formProblem(errors.root?.server?.message, request);
  const hint = 'What you saw that makes the baby ready: readings, the last overnight study, feeding and growth.';
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Ask to step down" className="flex flex-col gap-3">
      {conflict ? <Alert tone="warn">{problem}</Alert> : <ErrorSummary attempt={submitCount} failure={request.error} problem={problem} />}
      <div className="flex flex-col gap-1">
        <label htmlFor={id} className="font-semibold text-ink-900">Why the baby is ready</label>
        <p id={`${id}-hint`} className="text-sm text-ink-500">{hint}</p>
        <textarea id={id} rows={3} aria-invalid={errors.reason ? true : undefined} aria-describedby={describedBy(id, hint, errors.reason?.message)}
          className={`block w-full rounded-lg border bg-surface-0 px-3 py-2 text-base text-ink-900 ${errors.reason ? 'border-danger-600' : 'border-surface-300'}`}
          {...register('reason')} />
        {errors.reason?.message && (
          <p id={`${id}-error`} className="text-sm font-semibold text-danger-800"><span aria-hidden="true">⚠ </span>{errors.reason.message}</p>
        )}
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={request.isPending}>{request.isPending ? 'Sending…' : 'Send to the consultant'}</Button>
        <Button variant="secondary" onClick={onClose} disabled={request.isPending}>Cancel</Button>
      </div>
    </form>
  );
}

/** The nurse's or coordinator's request; the next rung comes from policy and a consultant decides it. */
export function StepDownAction({ infantId, waiting, onRequested }: StepDownActionProps) {
  const [open, setOpen] = useState(false);
  const ask = !open && !waiting ? <Button variant="secondary" size="sm" onClick={() => setOpen(true)}>Ask to step down</Button> : undefined;
  return (
    <Card title="Step down" actions={ask}>
      {waiting ? (
        <p className="text-ink-700">A proposal is waiting for sign-off. A step down can be asked for once it is decided.</p>
      ) : open ? (
        <StepDownForm infantId={infantId} onRequested={onRequested} onClose={() => setOpen(false)} />
      ) : (
        <p className="text-ink-700">Propose the next lower setting from the programme’s steps. A consultant signs it off before anything changes.</p>
      )}
    </Card>
  );
}
