import { useFormContext, useWatch } from 'react-hook-form';
import type { CreateJourneyFormValues } from '@shared/schemas/journeys';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { asNumber } from '../../../lib/form-values';

const big = 'min-h-13 text-xl';
const optionalText = { setValueAs: (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v) };

function ModeChoice() {
  const { register, formState: { errors } } = useFormContext<CreateJourneyFormValues>();
  const mode = useWatch<CreateJourneyFormValues, 'mode'>({ name: 'mode' });
  const choices = [
    { value: 'road', label: 'By road', detail: 'Car, coach or train' },
    { value: 'flight', label: 'By air', detail: 'A flight' },
  ] as const;
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-2 text-lg font-semibold text-ink-900">How are you travelling?</legend>
      <div className="grid gap-2 sm:grid-cols-2">
        {choices.map((c) => (
          <label
            key={c.value}
            className={`flex min-h-14 cursor-pointer items-start gap-3 rounded-xl border-2 p-3 ${mode === c.value ? 'border-brand-600 bg-brand-50' : 'border-surface-300 bg-surface-0'}`}
          >
            <input type="radio" value={c.value} className="mt-1 size-6 accent-brand-600" {...register('mode')} />
            <span className="flex flex-col">
              <span className="text-xl font-semibold text-ink-900">{c.label}</span>
              <span className="text-ink-700">{c.detail}</span>
            </span>
          </label>
        ))}
      </div>
      {errors.mode?.message && <p className="text-sm font-semibold text-danger-800">{errors.mode.message}</p>}
    </fieldset>
  );
}

function PlaceFields() {
  const { register, formState: { errors } } = useFormContext<CreateJourneyFormValues>();
  const mode = useWatch<CreateJourneyFormValues, 'mode'>({ name: 'mode' });
  return (
    <>
      <TextField label="Where are you going?" autoComplete="off" className={big} error={errors.destinationName?.message} {...register('destinationName')} />
      {mode === 'flight' ? (
        <>
          <TextField
            label="Cabin altitude in feet (optional)"
            hint="Leave it empty to plan for 8,000 ft, the thinnest cabin air allowed in normal flight. Only fill it in if the airline gave a lower figure."
            type="number" inputMode="numeric" step="any" autoComplete="off" className={big}
            error={errors.cabinAltitudeFt?.message}
            {...register('cabinAltitudeFt', asNumber)}
          />
          <TextField
            label="Height of the destination in metres (optional)"
            hint="If you are staying somewhere high after landing."
            type="number" inputMode="numeric" step="any" autoComplete="off" className={big}
            error={errors.destinationElevationM?.message}
            {...register('destinationElevationM', asNumber)}
          />
        </>
      ) : (
        <TextField
          label="Height of the destination in metres"
          hint="Height above sea level. A map app or your team can tell you."
          type="number" inputMode="numeric" step="any" autoComplete="off" className={big}
          error={errors.destinationElevationM?.message}
          {...register('destinationElevationM', asNumber)}
        />
      )}
    </>
  );
}

// A date box left empty fails the shared format rule; its "like 2026-12-03" example does not match the picker the
// phone shows, so an empty box asks for the day instead.
const dayError = (value: unknown, message: string | undefined, ask: string) => (message && !value ? ask : message);

function WhenFields() {
  const { register, formState: { errors } } = useFormContext<CreateJourneyFormValues>();
  const [departOn, returnOn] = useWatch<CreateJourneyFormValues, ['departOn', 'returnOn']>({ name: ['departOn', 'returnOn'] });
  return (
    <>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Leaving on" type="date" className={big}
          error={dayError(departOn, errors.departOn?.message, 'Choose the day you leave')}
          {...register('departOn')}
        />
        <TextField
          label="Back home on" type="date" className={big}
          error={dayError(returnOn, errors.returnOn?.message, 'Choose the day you come home')}
          {...register('returnOn')}
        />
      </div>
      <TextField
        label="Hours away from your home oxygen supply"
        hint="All the time your baby will need cylinders: the journey there and back, and the stay if there is no concentrator there."
        type="number" inputMode="decimal" step="any" autoComplete="off" className={big}
        error={errors.hoursAway?.message}
        {...register('hoursAway', asNumber)}
      />
      <TextAreaField label="Anything else the team should know (optional)" error={errors.notes?.message} {...register('notes', optionalText)} />
    </>
  );
}

export function JourneyFormFields() {
  return (
    <>
      <ModeChoice />
      <PlaceFields />
      <WhenFields />
    </>
  );
}
