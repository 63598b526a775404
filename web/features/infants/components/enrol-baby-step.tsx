import { useFormContext } from 'react-hook-form';
import { DIAGNOSES, DIAGNOSIS_LABELS } from '@shared/schemas/infants';
import { SelectField, TextField } from '../../../components/ui/field';
import { asNumber } from '../../../lib/form-values';
import { Choice, ChoiceGroup } from './choice-fields';
import type { EnrolValues } from './enrol-values';
import { errorText } from './form-helpers';

export function EnrolBabyStep() {
  const {
    register,
    formState: { errors },
  } = useFormContext<EnrolValues>();
  const err = (path: string, whenEmpty?: string) => errorText(errors, path, whenEmpty);
  return (
    <div className="flex flex-col gap-5">
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Given name" autoComplete="off" error={err('baby.givenName')} {...register('baby.givenName')} />
        <TextField label="Family name" autoComplete="off" error={err('baby.familyName')} {...register('baby.familyName')} />
        <SelectField label="Sex" error={err('baby.sex', 'Choose one')} {...register('baby.sex')}>
          <option value="">Select</option>
          <option value="female">Female</option>
          <option value="male">Male</option>
          <option value="unknown">Not known</option>
        </SelectField>
        <TextField label="Birth date" type="date" error={err('baby.birthDate')} {...register('baby.birthDate')} />
      </div>
      <ChoiceGroup
        legend="Gestation at birth"
        error={err('baby.gestation.weeks', 'Enter the weeks') ?? err('baby.gestation.days', 'Enter the days (0 if none)')}
        inline
      >
        <div className="grid w-full grid-cols-2 gap-4 sm:max-w-sm">
          <TextField label="Weeks" type="number" inputMode="numeric" min={22} max={44} {...register('baby.gestation.weeks', asNumber)} />
          <TextField label="Days" type="number" inputMode="numeric" min={0} max={6} {...register('baby.gestation.days', asNumber)} />
        </div>
      </ChoiceGroup>
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField
          label="Birth weight (g)"
          type="number"
          inputMode="numeric"
          error={err('baby.birthWeightG')}
          {...register('baby.birthWeightG', asNumber)}
        />
        <TextField
          label="Current weight (kg)"
          type="number"
          inputMode="decimal"
          step="any"
          error={err('baby.weightKg')}
          {...register('baby.weightKg', asNumber)}
        />
        <TextField label="Weighed on" type="date" error={err('baby.weightDate')} {...register('baby.weightDate')} />
      </div>
      <ChoiceGroup legend="Diagnoses" hint="Tick all that apply." error={err('baby.diagnoses')}>
        {DIAGNOSES.map((diagnosis) => (
          <Choice key={diagnosis} type="checkbox" value={diagnosis} label={DIAGNOSIS_LABELS[diagnosis]} {...register('baby.diagnoses')} />
        ))}
      </ChoiceGroup>
    </div>
  );
}
