import { useId } from 'react';
import { useFormContext } from 'react-hook-form';
import type { z } from 'zod';
import { READING_STATES, READING_STATE_LABELS, type createReadingSchema } from '@shared/schemas/readings';
import { describedBy, TextField } from '../../../components/ui/field';
import { asNumber } from '../../../lib/form-values';
import { asOptionalText } from './reading-values';

/** The fields a new reading and a correction have in common; both forms use the same names as the shared schema. */
export type ReadingFieldValues = Pick<z.input<typeof createReadingSchema>, 'spo2' | 'pulse' | 'flowLpm' | 'state' | 'notes'>;

const bigNumber = 'min-h-12 text-xl tabular-nums';

// A family reads the numbers off the home oximeter and the flowmeter; the labels use their words.
const LABELS = {
  staff: { spo2: 'SpO2 (%)', pulse: 'Pulse (/min)', flow: 'Flow at the time (L/min)', flowHint: '0 if the baby was off oxygen' },
  family: { spo2: 'Oxygen level shown on the monitor (%)', pulse: 'Heart rate shown on the monitor', flow: 'Flowmeter setting (litres per minute)', flowHint: '0 if your baby was not on oxygen' },
};

export function FigureFields({ forFamily = false }: { forFamily?: boolean }) {
  const words = LABELS[forFamily ? 'family' : 'staff'];
  const { register, formState } = useFormContext<ReadingFieldValues>();
  const { errors } = formState;
  return (
    <div className="grid grid-cols-2 gap-3">
      <TextField label={words.spo2} type="number" inputMode="numeric" autoComplete="off" className={bigNumber}
        error={errors.spo2?.message} {...register('spo2', asNumber)} />
      <TextField label={words.pulse} type="number" inputMode="numeric" autoComplete="off" className={bigNumber}
        error={errors.pulse?.message} {...register('pulse', asNumber)} />
      <div className="col-span-2">
        <TextField label={words.flow} type="number" inputMode="decimal" step="any" autoComplete="off" className={bigNumber}
          hint={words.flowHint} error={errors.flowLpm?.message} {...register('flowLpm', asNumber)} />
      </div>
    </div>
  );
}

/** Four large choices, so a thumb picks the right one at the door; a visible dot marks the choice, not colour alone. */
export function StateChoice() {
  const { register, formState } = useFormContext<ReadingFieldValues>();
  const error = formState.errors.state?.message;
  const errorId = useId();
  return (
    <fieldset aria-describedby={error ? errorId : undefined} aria-invalid={error ? true : undefined} className="flex flex-col gap-2">
      <legend className="mb-1 font-semibold text-ink-900">The baby was</legend>
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        {READING_STATES.map((state) => (
          <label key={state}
            className={`flex min-h-14 cursor-pointer items-center gap-3 rounded-xl border-2 bg-surface-0 px-3 text-lg font-semibold text-ink-900 has-[:checked]:border-brand-600 has-[:checked]:bg-brand-50 ${
              error ? 'border-danger-600' : 'border-surface-200'}`}>
            <input type="radio" value={state} className="size-5 shrink-0 accent-brand-600" {...register('state')} />
            {READING_STATE_LABELS[state]}
          </label>
        ))}
      </div>
      {error && (
        <p id={errorId} className="text-sm font-semibold text-danger-800">
          <span aria-hidden="true">⚠ </span>
          {error}
        </p>
      )}
    </fieldset>
  );
}

export function NotesField() {
  const { register, formState } = useFormContext<ReadingFieldValues>();
  const error = formState.errors.notes?.message;
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold text-ink-900">Notes (optional)</label>
      <textarea id={id} rows={2} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, undefined, error)}
        className={`block w-full rounded-lg border bg-surface-0 px-3 py-2 text-base text-ink-900 ${error ? 'border-danger-600' : 'border-surface-300'}`}
        {...register('notes', asOptionalText)} />
      {error && (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger-800">
          <span aria-hidden="true">⚠ </span>
          {error}
        </p>
      )}
    </div>
  );
}
