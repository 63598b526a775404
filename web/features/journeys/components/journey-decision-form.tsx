import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { journeyDecisionSchema, type Journey, type JourneyDecisionInput } from '@shared/schemas/journeys';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/field';
import { errorMessage, isApiError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import type { useDecideJourney } from '../api/decide-journey';

type Values = z.input<typeof journeyDecisionSchema>;
const optionalText = { setValueAs: (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v) };

/** The shared rule (declining needs a reason), plus the server's: approving beyond the cannula needs one too. */
const decisionSchemaFor = (journey: Journey) =>
  journeyDecisionSchema.superRefine((d, ctx) => {
    if (d.decision === 'approve' && journey.plan?.exceedsCannula && !(d.reason && d.reason.length >= 2)) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: 'The flow needed there is beyond the cannula: record why you approve this plan' });
    }
  });

interface JourneyDecisionFormProps {
  journey: Journey;
  mutation: ReturnType<typeof useDecideJourney>;
  onDecided: () => void;
}

export function JourneyDecisionForm({ journey, mutation, onDecided }: JourneyDecisionFormProps) {
  const { register, handleSubmit, setError, control, formState: { errors, submitCount } } = useForm<Values, unknown, JourneyDecisionInput>({
    resolver: zodResolver(decisionSchemaFor(journey)),
    defaultValues: { decision: 'approve', rowVersion: journey.rowVersion },
  });
  const decision = useWatch({ control, name: 'decision' });
  const reasonRequired = decision === 'decline' || !!journey.plan?.exceedsCannula;

  const onSubmit = handleSubmit((input) =>
    mutation.mutate(input, {
      onSuccess: onDecided,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, ['reason', 'decision']);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );
  const handledInline = isApiError(mutation.error) && ['validation_failed', 'conflict'].includes(mutation.error.code);
  const problem = errors.root?.server?.message ?? (mutation.isError && !handledInline ? errorMessage(mutation.error) : undefined);
  const choices = [
    { value: 'approve', label: 'Approve the journey plan', detail: 'The family sees the flow there and the cylinders to take' },
    { value: 'decline', label: 'Do not approve', detail: 'Say why; the team is told' },
  ] as const;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Journey decision" className="flex flex-col gap-4">
      <ErrorSummary attempt={submitCount} failure={mutation.error} problem={problem} />
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-2 font-semibold text-ink-900">Your decision</legend>
        <div className="grid gap-2 md:grid-cols-2">
          {choices.map((c) => (
            <label key={c.value} className={`flex min-h-14 cursor-pointer items-start gap-3 rounded-xl border-2 p-3 ${decision === c.value ? 'border-brand-600 bg-brand-50' : 'border-surface-200 bg-surface-0'}`}>
              <input type="radio" value={c.value} className="mt-1 size-5 accent-brand-600" {...register('decision')} />
              <span className="flex flex-col">
                <span className="font-semibold text-ink-900">{c.label}</span>
                <span className="text-sm text-ink-700">{c.detail}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <TextAreaField
        label={reasonRequired ? 'Reason (required)' : 'Note for the record (optional)'}
        error={errors.reason?.message}
        {...register('reason', optionalText)}
      />
      <div>
        <Button type="submit" size="lg" variant={decision === 'decline' ? 'danger' : 'primary'} disabled={mutation.isPending}>
          {mutation.isPending ? 'Saving…' : decision === 'decline' ? 'Do not approve' : 'Approve'}
        </Button>
      </div>
    </form>
  );
}
