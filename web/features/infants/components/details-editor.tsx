import { useState } from 'react';
import { FormProvider, useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { updateInfantSchema, type InfantDetail, type UpdateInfantInput } from '@shared/schemas/infants';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { FormActions } from '../../../components/ui/form-actions';
import { showToast } from '../../../components/ui/toast-store';
import { detailMessages, errorMessage, isApiError } from '../../../lib/api-error';
import { WeightConfirm } from '../../../components/clinical/weight-confirm';
import { asNumber } from '../../../lib/form-values';
import { infantQueryOptions } from '../api/get-infant';
import { useUpdateInfant } from '../api/update-infant';
import { HomeFields } from './enrol-home-step';
import { errorText } from './form-helpers';
import { StaffSelect } from './staff-select';

type DetailsValues = z.input<typeof updateInfantSchema>;

function toValues(infant: InfantDetail): DetailsValues {
  return {
    rowVersion: infant.rowVersion,
    weightKg: infant.weightKg,
    weightDate: infant.weightDate,
    home: {
      address: infant.home.address,
      location: infant.home.location,
      source: infant.home.source as 'cylinder' | 'concentrator',
      o2Percent: infant.home.o2Percent,
    },
    nurseId: infant.nurse?.id,
    consultantId: infant.consultant?.id,
  };
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** Sends only what changed, so the history names the real change and an untouched home opens no new version. */
function changesOnly(values: UpdateInfantInput, before: DetailsValues): UpdateInfantInput {
  const patch: UpdateInfantInput = { rowVersion: values.rowVersion };
  if (values.weightKg !== before.weightKg || values.weightDate !== before.weightDate) {
    Object.assign(patch, { weightKg: values.weightKg, weightDate: values.weightDate, ...(values.weightConfirmed ? { weightConfirmed: true } : {}) });
  }
  if (!same(values.home, before.home)) patch.home = values.home;
  if (values.nurseId !== before.nurseId) patch.nurseId = values.nurseId;
  if (values.consultantId !== before.consultantId) patch.consultantId = values.consultantId;
  return patch;
}

export function DetailsEditor({ infant, onDone }: { infant: InfantDetail; onDone: () => void }) {
  const queryClient = useQueryClient();
  const update = useUpdateInfant(infant.id);
  const [conflict, setConflict] = useState<string>();
  const [weightWarnings, setWeightWarnings] = useState<string[] | null>(null);
  const form = useForm<DetailsValues, unknown, UpdateInfantInput>({
    resolver: zodResolver(updateInfantSchema),
    defaultValues: toValues(infant),
    mode: 'onTouched',
  });
  const { register, formState } = form;
  const err = (path: string) => errorText(formState.errors, path);

  const onSubmit = form.handleSubmit((values) => {
    const patch = changesOnly(values, toValues(infant));
    if (Object.keys(patch).length === 1) return onDone();
    update.mutate(patch, {
      onSuccess: () => {
        if (patch.weightKg !== undefined || patch.home) showToast('info', 'A new setting is being worked out.');
        else showToast('ok', 'Details saved.');
        onDone();
      },
      onError: (error) => {
        if (isApiError(error) && error.code === 'conflict') return setConflict(error.message);
        if (isApiError(error) && error.code === 'needs_confirmation') return setWeightWarnings(detailMessages(error.details?.weightKg));
        if (!isApiError(error) || !error.details) return;
        for (const [path, messages] of Object.entries(error.details)) {
          form.setError(path as Path<DetailsValues>, { type: 'server', message: detailMessages(messages).join(' ') });
        }
      },
    });
  });

  // Start again from the stored record: what was typed here was based on a version that no longer exists.
  const reload = async () => {
    const fresh = await queryClient.fetchQuery({ ...infantQueryOptions(infant.id), staleTime: 0 });
    form.reset(toValues(fresh));
    setConflict(undefined);
    update.reset();
  };
  const otherProblem = update.isError && !conflict && !weightWarnings && !(isApiError(update.error) && update.error.details) ? errorMessage(update.error) : undefined;

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
        {conflict && (
          <div role="alert" className="flex flex-col gap-2 rounded-lg border border-warn-200 bg-warn-50 p-3 text-warn-800">
            <p className="font-semibold">{conflict}</p>
            <div>
              <Button variant="secondary" size="sm" onClick={reload}>
                Reload the record
              </Button>
            </div>
          </div>
        )}
        <ErrorSummary attempt={formState.submitCount} failure={update.error} problem={otherProblem} />
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Current weight (kg)" type="number" inputMode="decimal" step="any" error={err('weightKg')} {...register('weightKg', asNumber)} />
          <TextField label="Weighed on" type="date" error={err('weightDate')} {...register('weightDate')} />
        </div>
        {weightWarnings && <WeightConfirm warnings={weightWarnings} name="weightConfirmed" />}
        <HomeFields />
        <div className="grid gap-4 sm:grid-cols-2">
          <StaffSelect staffRole="nurse" label="Home-care nurse" error={err('nurseId')} {...register('nurseId')} />
          <StaffSelect staffRole="consultant" label="Consultant" error={err('consultantId')} {...register('consultantId')} />
        </div>
        <p className="text-sm text-ink-700">A change of weight or home opens a new proposal for the consultant.</p>
        <FormActions pending={update.isPending} submitLabel="Save details" onCancel={onDone} />
      </form>
    </FormProvider>
  );
}
