import type { ReactNode } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import type { RecordingUploadFields } from '@shared/schemas/recordings';
import { SelectField, TextField } from '../../../components/ui/field';
import { blankIsNone, readable } from './column-labels';

export type TimeLayout = 'one' | 'two';

const TIME_FORMATS = [
  { value: 'auto', label: 'Work it out from the file' },
  { value: 'local', label: 'Date and time on the oximeter’s clock (24/11/2026 21:00:00)' },
  { value: 'iso', label: 'Date and time with offset (2026-11-20T21:00:00Z)' },
  { value: 'seconds', label: 'Seconds from the start (0, 1, 2…)' },
] as const;

const DATE_ORDERS = [
  { value: '', label: 'Work it out from the dates' },
  { value: 'dmy', label: 'Day, month, year (24/11/2026)' },
  { value: 'mdy', label: 'Month, day, year (11/24/2026)' },
  { value: 'ymd', label: 'Year, month, day (2026-11-24)' },
] as const;

const timeZones = (() => {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return [];
  }
})();

interface ClockFieldsProps {
  layout: TimeLayout;
  form: UseFormReturn<RecordingUploadFields>;
  options: (none: string) => ReactNode;
  familyTimeZone: string;
}

/** Which column(s) hold the time, and how to read a clock time: the date order and the clock's time zone. */
export function ClockFields({ layout, form, options, familyTimeZone }: ClockFieldsProps) {
  const { register, formState: { errors } } = form;
  // Keys: a select in one layout must not inherit the value shown by the other layout's select in its place.
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      {layout === 'one' ? (
        <>
          <SelectField key="timestamp" label="Time" error={readable(errors.timestampColumn?.message)} {...register('timestampColumn', blankIsNone)}>
            {options('Choose a column')}
          </SelectField>
          <SelectField key="format" label="How the time is written" error={errors.timeFormat?.message} {...register('timeFormat')}>
            {TIME_FORMATS.map((format) => (
              <option key={format.value} value={format.value}>{format.label}</option>
            ))}
          </SelectField>
        </>
      ) : (
        <>
          <SelectField key="date" label="Date" error={readable(errors.dateColumn?.message)} {...register('dateColumn', blankIsNone)}>
            {options('Choose a column')}
          </SelectField>
          <SelectField key="clock" label="Time of day" error={readable(errors.timeColumn?.message)} {...register('timeColumn', blankIsNone)}>
            {options('Choose a column')}
          </SelectField>
        </>
      )}
      <SelectField label="Date order" hint="Asked for only when the file’s dates do not settle it" error={errors.dateOrder?.message} {...register('dateOrder', blankIsNone)}>
        {DATE_ORDERS.map((order) => (
          <option key={order.value} value={order.value}>{order.label}</option>
        ))}
      </SelectField>
      <TextField label="Time zone of the oximeter’s clock" list="nestflow-recording-zones" autoComplete="off"
        hint={`Leave empty for the family’s time zone (${familyTimeZone}). Clock changes are taken into account.`}
        error={errors.timeZone?.message} {...register('timeZone', blankIsNone)} />
      <datalist id="nestflow-recording-zones">
        {timeZones.map((zone) => (
          <option key={zone} value={zone} />
        ))}
      </datalist>
    </div>
  );
}
