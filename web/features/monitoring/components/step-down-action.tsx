import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import type { Prescription } from '@shared/schemas/prescriptions';
import { stepDownRequestSchema, type StepDownPreview } from '@shared/schemas/step-downs';
import { Alert } from '../../../components/ui/alert';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Spinner } from '../../../components/ui/spinner';
import { describedBy } from '../../../components/ui/field';
import { detailMessages, errorMessage, isApiError } from '../../../lib/api-error';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useStepDownChecks } from '../../step-downs/api/get-step-down-checks';
import { RuleChecks } from '../../step-downs/components/rule-checks';
import { useRequestStepDown } from '../api/request-step-down';

interface StepDownActionProps {
  infantId: string;
  /** A proposal already waits for sign-off, so another request would be refused. */
  waiting: boolean;
  onRequested: (rx: Prescription) => void;
}

interface FormValues {
  reason: string;
  overrideReason: string;
}

/** The shared contract; with any rule unmet the reason to ask anyway is always sent, so its rule applies (as on the server). */
const formSchema = (unmet: number) =>
  z
    .object({ reason: z.string(), overrideReason: z.string() })
    .transform((v) => ({ reason: v.reason, ...(unmet > 0 ? { overrideReason: v.overrideReason } : {}) }))
    .pipe(stepDownRequestSchema);

function TextArea({ id, label, hint, error, registration }: { id: string; label: string; hint: string; error?: string; registration: ReturnType<ReturnType<typeof useForm<FormValues>>['register']> }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold text-ink-900">{label}</label>
      <p id={`${id}-hint`} className="text-sm text-ink-500">{hint}</p>
      <textarea id={id} rows={3} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)}
        className={`block w-full rounded-lg border bg-surface-0 px-3 py-2 text-base text-ink-900 ${error ? 'border-danger-600' : 'border-surface-300'}`}
        {...registration} />
      {error && <p id={`${id}-error`} className="text-sm font-semibold text-danger-800"><span aria-hidden="true">⚠ </span>{error}</p>}
    </div>
  );
}

function StepDownForm({ infantId, preview, onRequested, onClose }: Omit<StepDownActionProps, 'waiting'> & { preview: StepDownPreview; onClose: () => void }) {
  const id = useId();
  const unmet = preview.checks.filter((c) => !c.met).length;
  const request = useRequestStepDown(infantId, onRequested);
  const { register, handleSubmit, setError, formState: { errors, submitCount } } = useForm<FormValues, unknown, z.output<ReturnType<typeof formSchema>>>({
    resolver: zodResolver(formSchema(unmet)),
    defaultValues: { reason: '', overrideReason: '' },
  });
  const onSubmit = handleSubmit((input) =>
    request.mutate(input, {
      onSuccess: onClose,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, ['reason', 'overrideReason']);
        if (isApiError(error) && error.code === 'policy_not_met') leftover.push(error.message, ...detailMessages(error.details?.unmet));
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );
  const conflict = isApiError(request.error) && request.error.status === 409;
  const problem = formProblem(errors.root?.server?.message, request);
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Ask to step down" className="flex flex-col gap-4">
      {conflict ? <Alert tone="warn">{problem}</Alert> : <ErrorSummary attempt={submitCount} failure={request.error} problem={problem} />}
      {preview.next && <p className="text-ink-900">Next step: <span className="font-bold">{preview.next.label}</span></p>}
      <div className="flex flex-col gap-2">
        <h3 className="font-bold text-ink-900">
          {unmet === 0 ? 'Every programme rule for a step down is met' : `${unmet} of ${preview.checks.length} programme rules not met`}
        </h3>
        <RuleChecks checks={preview.checks} />
      </div>
      <TextArea id={`${id}-reason`} label="Why the baby is ready" hint="What you saw that makes the baby ready: readings, the last overnight study, feeding and growth."
        error={errors.reason?.message} registration={register('reason')} />
      {unmet > 0 && (
        <TextArea id={`${id}-override`} label="Why ask anyway (required)" hint="The consultant sees this beside the unmet rules; it is recorded and audited. At least 10 characters."
          error={errors.overrideReason?.message} registration={register('overrideReason')} />
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={request.isPending}>{request.isPending ? 'Sending…' : unmet > 0 ? 'Send to the consultant anyway' : 'Send to the consultant'}</Button>
        <Button variant="secondary" onClick={onClose} disabled={request.isPending}>Cancel</Button>
      </div>
    </form>
  );
}

function StepDownPanel({ infantId, onRequested, onClose }: Omit<StepDownActionProps, 'waiting'> & { onClose: () => void }) {
  const checks = useStepDownChecks(infantId, true);
  if (checks.isPending) return <Spinner label="Checking the programme’s rules" />;
  if (checks.isError) return <Alert>{errorMessage(checks.error)}</Alert>;
  if (checks.data.blockedReason) return <Alert tone="warn">{checks.data.blockedReason}</Alert>;
  return <StepDownForm infantId={infantId} preview={checks.data} onRequested={onRequested} onClose={onClose} />;
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
        <StepDownPanel infantId={infantId} onRequested={onRequested} onClose={() => setOpen(false)} />
      ) : (
        <p className="text-ink-700">Propose the next lower setting from the programme’s steps. The programme’s rules are checked before it is sent, and a consultant signs it off before anything changes.</p>
      )}
    </Card>
  );
}
