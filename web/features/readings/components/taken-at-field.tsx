import { useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import type { z } from 'zod';
import type { createReadingSchema } from '@shared/schemas/readings';
import { TextField } from '../../../components/ui/field';
import { fromLocalInput, toLocalInput } from './reading-values';

type Values = z.input<typeof createReadingSchema>;

/** Holds an ISO instant for the schema while the phone shows its own date-and-time picker. */
export function TakenAtField({ control }: { control: Control<Values> }) {
  const {
    field: { name, ref, value, onChange, onBlur },
    fieldState,
  } = useController({ control, name: 'takenAt' });
  // The latest time the picker offers: now, when the form first showed (a reading cannot be from the future).
  const [latest] = useState(() => toLocalInput(new Date().toISOString()));
  return (
    <TextField
      label="Time taken"
      type="datetime-local"
      name={name}
      ref={ref}
      value={toLocalInput(value)}
      max={latest}
      onChange={(event) => onChange(fromLocalInput(event.target.value))}
      onBlur={onBlur}
      error={fieldState.error?.message}
    />
  );
}
