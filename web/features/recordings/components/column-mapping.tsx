import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { recordingUploadFieldsSchema, type RecordingUploadFields } from '../../../../shared/schemas/recordings';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { guessColumns } from './column-guess';

// The shared contract lets a role fall back to our own header name; here the file has none of ours, so the time
// and SpO2 columns must be chosen.
const mappingSchema = recordingUploadFieldsSchema.superRefine((fields, ctx) => {
  if (!fields.timestampColumn) ctx.addIssue({ code: 'custom', path: ['timestampColumn'], message: 'Choose the column with the time' });
  if (!fields.spo2Column) ctx.addIssue({ code: 'custom', path: ['spo2Column'], message: 'Choose the column with SpO2' });
});

const TIME_FORMATS = [
  { value: 'auto', label: 'Work it out from the file' },
  { value: 'iso', label: 'Date and time with offset (2026-11-20T21:00:00Z)' },
  { value: 'seconds', label: 'Seconds from the start (0, 1, 2…)' },
] as const;

// The shared rule names the other field by its key ("…already chosen for timestampColumn"); say it as the label.
const LABELS: Record<string, string> = { timestampColumn: 'Time', spo2Column: 'SpO2', pulseColumn: 'Pulse', statusColumn: 'Device status' };
const readable = (message?: string) => message?.replace(/\b(timestampColumn|spo2Column|pulseColumn|statusColumn)\b/g, (key) => LABELS[key]);

// An unchosen select sends nothing, so the server applies its own rule for that value.
const blankIsNone = { setValueAs: (value: string) => value || undefined };

interface ColumnMappingProps {
  found: readonly string[];
  busy: boolean;
  onSubmit: (fields: RecordingUploadFields) => void;
}

export function ColumnMapping({ found, busy, onSubmit }: ColumnMappingProps) {
  const { register, handleSubmit, formState: { errors } } = useForm({
    resolver: zodResolver(mappingSchema),
    defaultValues: { ...guessColumns(found), timeFormat: 'auto' as const },
  });
  const options = (none: string) => (
    <>
      <option value="">{none}</option>
      {found.map((header) => (
        <option key={header} value={header}>{header}</option>
      ))}
    </>
  );
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate aria-label="Match the columns" className="flex flex-col gap-4">
      <div>
        <h2 className="text-lg font-bold text-ink-900">Match the columns</h2>
        <p className="text-ink-700">
          This file’s columns have other names. Choose which column holds each value; the same file is then sent again.
        </p>
        <p className="mt-1 text-sm text-ink-500">Columns in the file: {found.join(', ') || 'none'}</p>
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Time" error={readable(errors.timestampColumn?.message)} {...register('timestampColumn', blankIsNone)}>
          {options('Choose a column')}
        </SelectField>
        <SelectField label="SpO2 (%)" error={readable(errors.spo2Column?.message)} {...register('spo2Column', blankIsNone)}>
          {options('Choose a column')}
        </SelectField>
        <SelectField label="Pulse (optional)" error={readable(errors.pulseColumn?.message)} {...register('pulseColumn', blankIsNone)}>
          {options('Not in this file')}
        </SelectField>
        <SelectField label="Device status (optional)" hint="Marks samples the oximeter flagged, e.g. probe off"
          error={readable(errors.statusColumn?.message)} {...register('statusColumn', blankIsNone)}>
          {options('Not in this file')}
        </SelectField>
      </div>
      <SelectField label="How the time is written" error={errors.timeFormat?.message} {...register('timeFormat')}>
        {TIME_FORMATS.map((format) => (
          <option key={format.value} value={format.value}>{format.label}</option>
        ))}
      </SelectField>
      <div>
        <Button type="submit" size="lg" disabled={busy} className="w-full sm:w-auto">
          {busy ? 'Uploading…' : 'Upload with these columns'}
        </Button>
      </div>
    </form>
  );
}
