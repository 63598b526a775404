import { useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { recordingUploadFieldsSchema, type RecordingUploadFields, type SavedMapping } from '@shared/schemas/recordings';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { Choice, ChoiceGroup } from '../../infants/components/choice-fields';
import { guessColumns } from './column-guess';
import { blankIsNone, readable } from './column-labels';
import { ClockFields, type TimeLayout } from './column-time-fields';

// The shared contract lets a role fall back to our own header name; here the file has none of ours, so the time
// (one column, or a date and a time column) and SpO2 must be chosen.
const oneColumn = recordingUploadFieldsSchema.superRefine((fields, ctx) => {
  if (!fields.timestampColumn) ctx.addIssue({ code: 'custom', path: ['timestampColumn'], message: 'Choose the column with the time' });
  if (!fields.spo2Column) ctx.addIssue({ code: 'custom', path: ['spo2Column'], message: 'Choose the column with SpO2' });
});
const twoColumns = recordingUploadFieldsSchema.superRefine((fields, ctx) => {
  if (!fields.dateColumn && !fields.timeColumn) {
    ctx.addIssue({ code: 'custom', path: ['dateColumn'], message: 'Choose the column with the date' });
    ctx.addIssue({ code: 'custom', path: ['timeColumn'], message: 'Choose the column with the time' });
  }
  if (!fields.spo2Column) ctx.addIssue({ code: 'custom', path: ['spo2Column'], message: 'Choose the column with SpO2' });
});

interface ColumnMappingProps {
  found: readonly string[];
  /** The mapping used last time for a file with these column names, chosen again unless changed. */
  saved: SavedMapping;
  /** Where local clock times are read when no zone is chosen. */
  familyTimeZone: string;
  busy: boolean;
  onSubmit: (fields: RecordingUploadFields) => void;
}

export function ColumnMapping({ found, saved, familyTimeZone, busy, onSubmit }: ColumnMappingProps) {
  const start = saved ?? { ...guessColumns(found), timeFormat: 'auto' as const };
  const [layout, setLayout] = useState<TimeLayout>(start.dateColumn !== undefined ? 'two' : 'one');
  // useForm takes its options afresh on every render, so the resolver always sees the layout on show: only the
  // fields on show are validated and sent.
  const resolver: Resolver<RecordingUploadFields> = (values, context, options) => {
    const { timestampColumn, dateColumn, timeColumn, ...rest } = values;
    const shown = layout === 'two' ? { ...rest, dateColumn, timeColumn, timeFormat: 'auto' as const } : { ...rest, timestampColumn };
    return zodResolver(layout === 'two' ? twoColumns : oneColumn)(shown, context, options as never) as never;
  };
  const form = useForm<RecordingUploadFields>({ resolver, defaultValues: { timeFormat: 'auto', ...start } });
  const { register, handleSubmit, formState: { errors } } = form;
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
        {saved && <p className="mt-1 font-semibold text-ink-900">Chosen as for the last file with these columns. Check them before uploading.</p>}
        <p className="mt-1 text-sm text-ink-500">Columns in the file: {found.join(', ') || 'none'}</p>
      </div>
      <ChoiceGroup legend="Where the time is" inline>
        <Choice name="time-layout" label="One column" checked={layout === 'one'} onChange={() => setLayout('one')} />
        <Choice name="time-layout" label="A date column and a time column" checked={layout === 'two'} onChange={() => setLayout('two')} />
      </ChoiceGroup>
      <ClockFields layout={layout} form={form} options={options} familyTimeZone={familyTimeZone} />
      <div className="grid gap-4 sm:grid-cols-2">
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
      <div>
        <Button type="submit" size="lg" disabled={busy} className="w-full sm:w-auto">
          {busy ? 'Uploading…' : 'Upload with these columns'}
        </Button>
      </div>
    </form>
  );
}
