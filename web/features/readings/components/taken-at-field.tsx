import { useController, type Control } from 'react-hook-form';
import type { z } from 'zod';
import type { createReadingSchema } from '../../../../shared/schemas/readings';
import { TextField } from '../../../components/ui/field';
import { fromLocalInput, toLocalInput } from './reading-values';

type Values = z.input<typeof createReadingSchema>;

/** Holds an ISO instant for the schema while the phone shows its own date-and-time picker. */
export function TakenAtField({ control }: { control: Control<Values> }) {
  const { field, fieldState } = useController({ control, name: 'takenAt' });
  return (
    <TextField
      label="Time taken"
      type="datetime-local"
      name={field.name}
      ref={field.ref}
      value={toLocalInput(field.value)}
      max={toLocalInput(new Date().toISOString())}
      onChange={(event) => field.onChange(fromLocalInput(event.target.value))}
      onBlur={field.onBlur}
      error={fieldState.error?.message}
    />
  );
}
