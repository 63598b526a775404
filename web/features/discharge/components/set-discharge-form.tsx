import { useForm } from 'react-hook-form';
import type { Discharge } from '@shared/schemas/discharge';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { FormActions } from '../../../components/ui/form-actions';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useSetDischargeDate } from '../api/set-discharge-date';
import { notReadyMessage } from './discharge-words';

type Values = { date: string; overrideReason: string };
const FIELDS = ['date', 'overrideReason'] as const;

/**
 * Sets the discharge date. With steps missing only a consultant can go on, giving the reason (the API decides;
 * the box is offered to consultants only, and a refusal is shown in words).
 */
export function SetDischargeForm({ infantId, discharge, canOverride, onClose }: {
  infantId: string; discharge: Discharge; canOverride: boolean; onClose: () => void;
}) {
  const setDate = useSetDischargeDate(infantId);
  const form = useForm<Values>({ defaultValues: { date: discharge.dischargedOn ?? '', overrideReason: '' } });
  const { register, formState: { errors, submitCount }, setError } = form;
  const override = canOverride && !discharge.ready;
  const onSubmit = form.handleSubmit((v) =>
    setDate.mutate({ date: v.date, ...(override && v.overrideReason.trim() ? { overrideReason: v.overrideReason } : {}) }, {
      onSuccess: onClose,
      onError: (error) => {
        const notReady = notReadyMessage(error, discharge.items);
        if (notReady) return setError('root.server', { type: 'server', message: notReady });
        const leftover = applyServerFieldErrors(error, setError, FIELDS);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Set discharge date" className="flex flex-col gap-3 rounded-lg border border-surface-200 p-3">
      <ErrorSummary attempt={submitCount} failure={setDate.error} problem={formProblem(errors.root?.server?.message, setDate)} />
      <TextField label="Discharge date" type="date" className="max-w-60" error={errors.date?.message} {...register('date')} />
      {override && (
        <TextAreaField label="Reason to set the date before every step is done" rows={3}
          hint="Only a consultant can do this; the reason and the steps not done are kept in the record and the letter."
          error={errors.overrideReason?.message} {...register('overrideReason')} />
      )}
      <FormActions pending={setDate.isPending} submitLabel="Save the discharge date" onCancel={onClose} />
    </form>
  );
}
