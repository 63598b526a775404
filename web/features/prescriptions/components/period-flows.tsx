import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { SelectField } from '../../../components/ui/field';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { PERIODS, SAME, type DecisionFormValues } from './decision-rules';

const PERIOD_LABELS = { awake: 'While awake', asleep: 'While asleep', feeding: 'While feeding' } as const;

interface PeriodFlowsProps {
  steps: readonly number[];
  approvedFlowLpm: number | null;
  register: UseFormRegister<DecisionFormValues>;
  errors: FieldErrors<DecisionFormValues>;
}

/** Optional: a different flow for part of the day. Left alone, the approved flow applies day and night. */
export function PeriodFlows({ steps, approvedFlowLpm, register, errors }: PeriodFlowsProps) {
  const hasError = PERIODS.some((p) => errors.periods?.[p]);
  const same = approvedFlowLpm === null ? 'Same as the approved flow' : `Same (${formatFlow(approvedFlowLpm)} L/min)`;
  return (
    <details open={hasError} className="rounded-lg border border-surface-200 p-3">
      <summary className="cursor-pointer font-semibold text-ink-900">Different flow while awake, asleep or feeding</summary>
      <div className="mt-3 grid gap-3 sm:grid-cols-3">
        {PERIODS.map((period) => (
          <SelectField key={period} label={PERIOD_LABELS[period]} error={errors.periods?.[period]?.message} {...register(`periods.${period}`)}>
            <option value={SAME}>{same}</option>
            <option value="0">Off (no oxygen)</option>
            {steps.map((step) => (
              <option key={step} value={String(step)}>
                {formatFlow(step)} L/min
              </option>
            ))}
          </SelectField>
        ))}
      </div>
    </details>
  );
}
