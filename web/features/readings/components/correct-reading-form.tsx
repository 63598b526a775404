import { FormProvider, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { updateReadingSchema, type Reading, type UpdateReadingInput } from '../../../../shared/schemas/readings';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { FormActions } from '../../../components/ui/form-actions';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useUpdateReading } from '../api/update-reading';
import { FigureFields, NotesField, StateChoice } from './reading-fields';

type Values = z.input<typeof updateReadingSchema>;
const FIELDS = ['spo2', 'pulse', 'flowLpm', 'state', 'notes'] as const;

const toValues = (r: Reading): Values => ({
  spo2: r.spo2, pulse: r.pulse ?? undefined, flowLpm: r.flowLpm ?? undefined, state: r.state, notes: r.notes ?? undefined,
});

/** Only what changed is sent, so the record of the correction names the real change. */
function changesOnly(values: UpdateReadingInput, before: Values): UpdateReadingInput {
  return Object.fromEntries(
    Object.entries(values).filter(([key, value]) => value !== undefined && value !== before[key as keyof Values]),
  ) as UpdateReadingInput;
}

export function CorrectReadingForm({ reading, onDone }: { reading: Reading; onDone: () => void }) {
  const update = useUpdateReading(reading.id);
  const form = useForm<Values, unknown, UpdateReadingInput>({ resolver: zodResolver(updateReadingSchema), defaultValues: toValues(reading) });

  const onSubmit = form.handleSubmit((values) => {
    const patch = changesOnly(values, toValues(reading));
    if (Object.keys(patch).length === 0) return onDone();
    update.mutate(patch, {
      onSuccess: onDone,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, form.setError, FIELDS);
        if (leftover.length) form.setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    });
  });

  const problem = formProblem(form.formState.errors.root?.server?.message, update);

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-label="Correct the reading" className="flex flex-col gap-4">
        <ErrorSummary attempt={form.formState.submitCount} failure={update.error} problem={problem} />
        <FigureFields />
        <StateChoice />
        <NotesField />
        <FormActions pending={update.isPending} submitLabel="Save correction" onCancel={onDone} />
      </form>
    </FormProvider>
  );
}
