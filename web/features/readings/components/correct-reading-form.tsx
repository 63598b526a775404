import { useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import { useQueryClient } from '@tanstack/react-query';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { updateReadingSchema, type Reading, type UpdateReadingInput } from '@shared/schemas/readings';
import { ConflictNotice } from '../../../components/ui/conflict-notice';
import { isApiError } from '../../../lib/api-error';
import { readingQueryOptions } from '../api/get-reading';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { FormActions } from '../../../components/ui/form-actions';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useUpdateReading } from '../api/update-reading';
import { FigureFields, NotesField, StateChoice } from './reading-fields';

type Values = z.input<typeof updateReadingSchema>;
const FIELDS = ['spo2', 'pulse', 'flowLpm', 'state', 'notes'] as const;

const CHANGED_ELSEWHERE = 'This reading was corrected elsewhere meanwhile. Reload it to see that correction, then make yours again.';

const toValues = (r: Reading): Values => ({
  rowVersion: r.rowVersion, spo2: r.spo2, pulse: r.pulse ?? undefined, flowLpm: r.flowLpm ?? undefined, state: r.state, notes: r.notes ?? undefined,
});

/** Only what changed is sent (with the version it was made on), so the record of the correction names the real change. */
function changesOnly(values: UpdateReadingInput, before: Values): UpdateReadingInput | null {
  const changed = Object.entries(values).filter(([key, value]) => key !== 'rowVersion' && value !== undefined && value !== before[key as keyof Values]);
  return changed.length ? ({ ...Object.fromEntries(changed), rowVersion: values.rowVersion } as UpdateReadingInput) : null;
}

const isVersionConflict = (error: unknown) => isApiError(error) && error.code === 'conflict' && !!error.details?.rowVersion;

export function CorrectReadingForm({ reading, onDone }: { reading: Reading; onDone: () => void }) {
  const update = useUpdateReading(reading.id);
  const queryClient = useQueryClient();
  const [conflict, setConflict] = useState(false);
  const form = useForm<Values, unknown, UpdateReadingInput>({ resolver: zodResolver(updateReadingSchema), defaultValues: toValues(reading) });

  const onSubmit = form.handleSubmit((values) => {
    const patch = changesOnly(values, toValues(reading));
    if (!patch) return onDone();
    update.mutate(patch, {
      onSuccess: onDone,
      onError: (error) => {
        if (isVersionConflict(error)) return setConflict(true);
        const leftover = applyServerFieldErrors(error, form.setError, FIELDS);
        if (leftover.length) form.setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    });
  });

  // What was typed was based on a version that no longer exists: start again from the stored one.
  const reload = async () => {
    const fresh = await queryClient.fetchQuery({ ...readingQueryOptions(reading.infantId, reading.id), staleTime: 0 });
    form.reset(toValues(fresh));
    setConflict(false);
    update.reset();
  };

  const problem = isVersionConflict(update.error) ? undefined : formProblem(form.formState.errors.root?.server?.message, update);

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-label="Correct the reading" className="flex flex-col gap-4">
        {conflict && <ConflictNotice message={CHANGED_ELSEWHERE} actionLabel="Reload the reading" onReload={reload} />}
        <ErrorSummary attempt={form.formState.submitCount} failure={update.error} problem={problem} />
        <FigureFields />
        <StateChoice />
        <NotesField />
        <FormActions pending={update.isPending} submitLabel="Save correction" onCancel={onDone} />
      </form>
    </FormProvider>
  );
}
