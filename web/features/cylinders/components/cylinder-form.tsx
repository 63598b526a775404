import { useForm, useWatch } from 'react-hook-form';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { cylinderCheckSchema, type CylinderCheckInput } from '@shared/schemas/journeys';
import type { CylinderType } from '@shared/schemas/policy';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { asNumber } from '../../../lib/form-values';

type Values = z.input<typeof cylinderCheckSchema>;

/** The shared rules, plus the one only the chosen cylinder can answer: a gauge cannot read above full. */
export const cylinderCheckSchemaFor = (cylinders: readonly CylinderType[]) =>
  cylinderCheckSchema.superRefine((input, ctx) => {
    const cylinder = cylinders.find((c) => c.id === input.cylinderId);
    if (!cylinder) {
      ctx.addIssue({ code: 'custom', path: ['cylinderId'], message: 'Choose one of the cylinders in the list' });
    } else if (input.gauge > cylinder.fullPressure) {
      ctx.addIssue({
        code: 'custom', path: ['gauge'],
        message: `At most ${cylinder.fullPressure} ${cylinder.unit}, the pressure this cylinder is full at. Check the gauge again.`,
      });
    }
  });

interface CylinderFormProps {
  cylinders: readonly CylinderType[];
  onCheck: (input: CylinderCheckInput) => void;
}

export function CylinderForm({ cylinders, onCheck }: CylinderFormProps) {
  const { register, handleSubmit, control, formState: { errors, submitCount } } = useForm<Values, unknown, CylinderCheckInput>({
    resolver: zodResolver(cylinderCheckSchemaFor(cylinders)),
    defaultValues: { cylinderId: cylinders.length === 1 ? cylinders[0].id : '' },
  });
  const chosenId = useWatch({ control, name: 'cylinderId' });
  const chosen = cylinders.find((c) => c.id === chosenId);
  const unit = chosen?.unit ?? 'bar or psi';
  return (
    <form onSubmit={handleSubmit(onCheck)} noValidate aria-label="Cylinder check" className="flex flex-col gap-4 text-lg">
      <ErrorSummary attempt={submitCount} />
      <SelectField label="Which cylinder?" error={errors.cylinderId?.message} className="min-h-13 text-lg" {...register('cylinderId')}>
        <option value="">Choose the cylinder</option>
        {cylinders.map((c) => (
          <option key={c.id} value={c.id}>
            {c.name}
          </option>
        ))}
      </SelectField>
      <TextField
        label={`What does the gauge read? (${unit})`}
        hint={chosen ? `Full is ${chosen.fullPressure} ${chosen.unit}. Change it at ${chosen.residualPressure} ${chosen.unit}.` : 'The number the needle points to on the cylinder gauge.'}
        type="number"
        inputMode="decimal"
        step="any"
        autoComplete="off"
        className="min-h-13 text-2xl tabular-nums"
        error={errors.gauge?.message}
        {...register('gauge', asNumber)}
      />
      <Button type="submit" size="lg" className="w-full sm:w-auto">
        Work out how long it lasts
      </Button>
    </form>
  );
}
