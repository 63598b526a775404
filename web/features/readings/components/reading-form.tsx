import type { FormEvent } from 'react';
import { useRef, useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { createReadingSchema, type CreateReadingInput, type Reading } from '@shared/schemas/readings';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { detailMessages, isApiError } from '../../../lib/api-error';
import { WeightConfirm } from '../../../components/clinical/weight-confirm';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { asNumber } from '../../../lib/form-values';
import { useCreateReading } from '../api/create-reading';
import { FigureFields, NotesField, StateChoice } from './reading-fields';
import { TakenAtField } from './taken-at-field';

export interface ReadingFormProps {
  infantId: string;
  /** The planned check this reading completes (from the nurse's day). */
  checkId?: string;
  /** The baby's current flow, so the usual case needs no typing. */
  defaultFlowLpm?: number | null;
  onSaved?: (reading: Reading) => void;
  /** A parent's home reading: no weight (the team weighs the baby) and wording for a family. */
  forFamily?: boolean;
}

type Values = z.input<typeof createReadingSchema>;
const FIELDS = ['takenAt', 'spo2', 'pulse', 'flowLpm', 'state', 'weightKg', 'notes'] as const;

const freshValues = (checkId?: string, defaultFlowLpm?: number | null): Values =>
  ({ takenAt: new Date().toISOString(), flowLpm: defaultFlowLpm ?? undefined, checkId }) as Values;

/**
 * The quick spot reading: a nurse at the door fills it with a thumb and saves it with one tap. After a save the
 * form starts again from scratch (a new instance): a reset keeps what the browser still holds in number inputs
 * whose fresh value is "empty", so the next reading would start from the last SpO2, pulse and notes.
 */
export function ReadingForm(props: ReadingFormProps) {
  const [round, setRound] = useState(0);
  const onSaved = (reading: Reading) => {
    setRound((n) => n + 1);
    props.onSaved?.(reading);
  };
  return <ReadingFormBody key={round} {...props} onSaved={onSaved} />;
}

function ReadingFormBody({ infantId, checkId, defaultFlowLpm, onSaved, forFamily = false }: ReadingFormProps) {
  const create = useCreateReading(infantId);
  // A second tap can land before the button re-renders as disabled; one reading must not be stored twice.
  const sending = useRef(false);
  const [weightWarnings, setWeightWarnings] = useState<string[] | null>(null);
  const form = useForm<Values, unknown, CreateReadingInput>({
    resolver: zodResolver(createReadingSchema),
    defaultValues: freshValues(checkId, defaultFlowLpm),
  });
  const { register, formState, setError } = form;

  // handleSubmit is called from the submit event, so the double-tap guard (a ref) is read then, never while drawing.
  const onSubmit = (event: FormEvent<HTMLFormElement>) => form.handleSubmit(async (values) => {
    if (sending.current) return;
    sending.current = true;
    // "Now" means when it is saved, unless the nurse set the time herself.
    const untouched = values.takenAt === formState.defaultValues?.takenAt;
    const input = untouched ? { ...values, takenAt: new Date().toISOString() } : values;
    try {
      const reading = await create.mutateAsync(input);
      onSaved?.(reading);
    } catch (error) {
      if (isApiError(error) && error.code === 'needs_confirmation') return setWeightWarnings(detailMessages(error.details?.weightKg));
      const leftover = applyServerFieldErrors(error, setError, FIELDS);
      // The error summary at the top of the form takes focus and links to each field, even one off screen.
      if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
    } finally {
      sending.current = false;
    }
  })(event);

  const problem = isApiError(create.error) && create.error.code === 'needs_confirmation' ? undefined : formProblem(formState.errors.root?.server?.message, create);
  const busy = create.isPending || formState.isSubmitting;

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-label="Spot reading" className="flex flex-col gap-4">
        <ErrorSummary attempt={formState.submitCount} failure={create.error} problem={problem} />
        <FigureFields forFamily={forFamily} />
        <StateChoice />
        {!forFamily && (
          <TextField label="Weight (kg, optional)" type="number" inputMode="decimal" step="any" autoComplete="off" className="min-h-12 text-xl tabular-nums"
            hint="Only if the baby was weighed today" error={formState.errors.weightKg?.message} {...register('weightKg', asNumber)} />
        )}
        {weightWarnings && <WeightConfirm warnings={weightWarnings} name="weightConfirmed" />}
        <NotesField />
        <TakenAtField control={form.control} />
        <Button type="submit" size="lg" disabled={busy} className="w-full">
          {busy ? 'Saving…' : forFamily ? 'Send the reading to the team' : 'Save reading'}
        </Button>
      </form>
    </FormProvider>
  );
}
