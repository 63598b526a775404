import { useForm, useWatch, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { Prescription } from '@shared/schemas/prescriptions';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { Alert } from '../../../components/ui/alert';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField } from '../../../components/ui/field';
import { errorMessage, isApiError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import type { useDecidePrescription } from '../api/decide-prescription';
import { DecisionModes } from './decision-modes';
import {
  approvedFlowOf, BELOW_REQUIRED_WARNING, decisionFormSchema, unmetChecksOf, defaultDecisionValues, isBelowRequired, PERIODS, SAME,
  type DecisionFormValues,
} from './decision-rules';
import { PeriodFlows } from './period-flows';
import { StepOptions } from './step-options';

const SERVER_FIELDS: readonly Path<DecisionFormValues>[] = ['flowLpm', 'reason', 'periods.awake', 'periods.asleep', 'periods.feeding'];
const INLINE_CODES = ['validation_failed', 'conflict'];

interface DecisionFormProps {
  rx: Prescription;
  steps: readonly number[];
  mutation: ReturnType<typeof useDecidePrescription>;
  onDecided: () => void;
}

function submitLabel(values: Pick<DecisionFormValues, 'mode' | 'flowLpm' | 'periods'>, rx: Prescription, pending: boolean): string {
  if (pending) return 'Saving…';
  if (values.mode === 'send_back') return 'Send back';
  const flow = approvedFlowOf(values, rx);
  if (flow === null) return 'Approve';
  const parts = PERIODS.filter((p) => values.periods[p] !== SAME).map((p) =>
    values.periods[p] === '0' ? `off ${p}` : `${formatFlow(Number(values.periods[p]))} ${p}`,
  );
  return `Approve ${formatFlow(flow)} L/min${isBelowRequired(flow, rx) ? ' (below required)' : ''}${parts.length ? ` · ${parts.join(' · ')}` : ''}`;
}

export function DecisionForm({ rx, steps, mutation, onDecided }: DecisionFormProps) {
  const { register, handleSubmit, setError, control, formState: { errors, submitCount } } = useForm({
    resolver: zodResolver(decisionFormSchema(rx)),
    defaultValues: defaultDecisionValues(rx),
  });
  const [mode, flowLpm, periods] = useWatch({ control, name: ['mode', 'flowLpm', 'periods'] });
  const below = mode === 'different' && flowLpm !== '' && isBelowRequired(Number(flowLpm), rx);
  const unmet = unmetChecksOf(rx).length;
  const reasonRequired = mode !== 'as_proposed' || unmet > 0;
  const periodsBelow = mode === 'send_back' ? [] : PERIODS.filter((p) => periods[p] !== SAME && isBelowRequired(Number(periods[p]), rx));

  const onSubmit = handleSubmit((decision) =>
    mutation.mutate(decision, {
      onSuccess: onDecided,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, mode === 'different' ? SERVER_FIELDS : SERVER_FIELDS.slice(1));
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );

  const handledInline = isApiError(mutation.error) && INLINE_CODES.includes(mutation.error.code);
  const formProblem = errors.root?.server?.message ?? (mutation.isError && !handledInline ? errorMessage(mutation.error) : undefined);

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Decision" className="flex flex-col gap-4">
      <ErrorSummary attempt={submitCount} failure={mutation.error} problem={formProblem} />
      <DecisionModes rx={rx} register={register} current={mode} />
      {mode === 'different' && (
        <SelectField label="Flowmeter step" error={errors.flowLpm?.message} {...register('flowLpm')}>
          <option value="">Choose a step</option>
          <StepOptions steps={steps} rx={rx} />
        </SelectField>
      )}
      {below && <Alert tone="warn">{BELOW_REQUIRED_WARNING}</Alert>}
      {unmet > 0 && mode !== 'send_back' && (
        <Alert tone="warn">{`${unmet} of the programme’s step-down rules ${unmet === 1 ? 'is' : 'are'} not met (see the evidence above). Approving needs your reason; it is recorded and audited.`}</Alert>
      )}
      <TextAreaField
        label={reasonRequired ? 'Reason (required)' : 'Note for the record (optional)'}
        hint={mode === 'send_back' ? 'The team sees this with the returned proposal.' : undefined}
        error={errors.reason?.message}
        {...register('reason')}
      />
      {mode !== 'send_back' && (
        <PeriodFlows steps={steps} approvedFlowLpm={approvedFlowOf({ mode, flowLpm }, rx)} register={register} errors={errors} />
      )}
      {periodsBelow.length > 0 && (
        <Alert tone="warn">
          {`Below the flow the computation requires while ${periodsBelow.join(' and while ')}. Say why in the ${reasonRequired ? 'reason' : 'note'}; it is recorded.`}
        </Alert>
      )}
      <div>
        <Button type="submit" size="lg" variant={mode === 'send_back' ? 'danger' : 'primary'} disabled={mutation.isPending}>
          {submitLabel({ mode, flowLpm, periods }, rx, mutation.isPending)}
        </Button>
      </div>
    </form>
  );
}
