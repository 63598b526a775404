import { useState } from 'react';
import { useFormContext, useWatch, type FieldValues, type Path } from 'react-hook-form';
import { TextField } from '../../../components/ui/field';
import { asNumber } from '../../../lib/form-values';
import { Choice, ChoiceGroup } from './choice-fields';
import { errorText } from './form-helpers';

export const PLACE_KEYS = ['elevationM', 'elevationFt', 'pressureMmHg'] as const;
export type PlaceKey = (typeof PLACE_KEYS)[number];

const PLACE_CHOICES: Record<PlaceKey, { choice: string; label: string; inputMode: 'numeric' | 'decimal' }> = {
  elevationM: { choice: 'Elevation in metres', label: 'Home elevation (m)', inputMode: 'numeric' },
  elevationFt: { choice: 'Elevation in feet', label: 'Home elevation (ft)', inputMode: 'numeric' },
  pressureMmHg: { choice: 'Measured air pressure', label: 'Measured local pressure (mmHg)', inputMode: 'decimal' },
};

interface PlaceFieldsProps {
  /** Path of the `{ elevationM } | { elevationFt } | { pressureMmHg }` object, e.g. `home.location`. */
  name: string;
}

/** One of three ways to place the home; switching clears the others so exactly one reaches the schema. */
export function PlaceFields({ name }: PlaceFieldsProps) {
  const { register, setValue, control, formState } = useFormContext<FieldValues>();
  const location = useWatch({ control, name }) as Partial<Record<PlaceKey, number>> | undefined;
  const given = PLACE_KEYS.find((key) => location?.[key] !== undefined);
  const [mode, setMode] = useState<PlaceKey>(given ?? 'elevationM');

  const choose = (next: PlaceKey) => {
    setMode(next);
    for (const key of PLACE_KEYS) {
      if (key !== next) setValue(`${name}.${key}` as Path<FieldValues>, undefined, { shouldDirty: true });
    }
  };

  const fieldPath = `${name}.${mode}`;
  const fieldError = errorText(formState.errors, fieldPath);
  // The shared "exactly one of …" message names the keys; on this screen it can only mean nothing was entered.
  const whole = errorText(formState.errors, name);
  const wholeError = whole?.startsWith('Give one of') ? 'Enter the home elevation or a measured pressure' : whole;
  return (
    <div className="flex flex-col gap-3">
      <ChoiceGroup legend="Where the home is" hint="Give the elevation, or an air pressure measured at home." inline>
        {PLACE_KEYS.map((key) => (
          <Choice key={key} name={`${name}-mode`} value={key} checked={mode === key} onChange={() => choose(key)} label={PLACE_CHOICES[key].choice} />
        ))}
      </ChoiceGroup>
      <TextField
        key={mode}
        label={PLACE_CHOICES[mode].label}
        type="number"
        inputMode={PLACE_CHOICES[mode].inputMode}
        step="any"
        className="sm:max-w-xs"
        error={fieldError ?? wholeError}
        {...register(fieldPath, asNumber)}
      />
    </div>
  );
}
