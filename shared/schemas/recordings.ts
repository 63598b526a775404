import { z } from 'zod';
import { pageQuerySchema, pagedSchema, plainText } from './common';
import { RECORDING_TIME_FORMATS } from '../recordings/limits';
import { DATE_ORDERS } from '../recordings/local-dates';

export const RECORDING_STATUSES = ['queued', 'analysing', 'done', 'failed'] as const;
export type RecordingStatus = (typeof RECORDING_STATUSES)[number];
export const RECORDING_STATUS_LABELS: Record<RecordingStatus, string> = {
  queued: 'Waiting to be analysed',
  analysing: 'Being analysed',
  done: 'Analysed',
  failed: 'Could not be analysed',
};

/** Error codes an upload can answer with, beyond the common ones (validation_failed, not_found, forbidden…). */
export const RECORDING_UPLOAD_ERRORS = [
  'not_multipart', 'no_file', 'bad_form', 'too_large', 'empty_file', 'not_csv', 'malformed_csv', 'wrong_columns', 'unreadable_rows', 'too_short', 'too_long',
  'date_order_unclear', 'clock_change',
] as const;
export type RecordingUploadError = (typeof RECORDING_UPLOAD_ERRORS)[number];

const columnName = plainText().trim().min(1, { error: 'Enter the column name' }).max(100, { error: 'At most 100 characters' });

const COLUMN_FIELDS = ['timestampColumn', 'dateColumn', 'timeColumn', 'spo2Column', 'pulseColumn', 'statusColumn'] as const;
const isTimeZone = (tz: string) => {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
};

/**
 * Form fields sent beside the file: a column mapping for exports not in our own format. The time is one
 * timestamp column, or a date column with a time column in the device's local time; `dateOrder` (found from the
 * dates when left out) and `timeZone` (the family's when left out) say how to read those.
 */
export const recordingUploadFieldsSchema = z
  .strictObject({
    timestampColumn: columnName.optional(),
    dateColumn: columnName.optional(),
    timeColumn: columnName.optional(),
    spo2Column: columnName.optional(),
    pulseColumn: columnName.optional(),
    statusColumn: columnName.optional(),
    timeFormat: z.enum(RECORDING_TIME_FORMATS, { error: 'Choose iso, seconds, local or auto' }).default('auto'),
    dateOrder: z.enum(DATE_ORDERS, { error: 'Choose dmy, mdy or ymd' }).optional(),
    timeZone: plainText().trim().min(1).max(60).refine(isTimeZone, { error: 'Choose a time zone from the list (for example Europe/London)' }).optional(),
  })
  .superRefine((f, ctx) => {
    const chosen = COLUMN_FIELDS.filter((k) => f[k] !== undefined);
    const seen = new Map<string, string>();
    for (const k of chosen) {
      const name = f[k]!.toLowerCase();
      if (seen.has(name)) ctx.addIssue({ code: 'custom', path: [k], message: `The same column is already chosen for ${seen.get(name)}` });
      else seen.set(name, k);
    }
    if ((f.dateColumn === undefined) !== (f.timeColumn === undefined)) {
      const missing = f.dateColumn === undefined ? 'dateColumn' : 'timeColumn';
      ctx.addIssue({ code: 'custom', path: [missing], message: missing === 'dateColumn' ? 'Choose the column with the date as well' : 'Choose the column with the time as well' });
    }
    if (f.timestampColumn !== undefined && (f.dateColumn !== undefined || f.timeColumn !== undefined)) {
      ctx.addIssue({ code: 'custom', path: ['timestampColumn'], message: 'Choose one date-and-time column, or a date column and a time column, not both' });
    }
  });
export type RecordingUploadFields = z.infer<typeof recordingUploadFieldsSchema>;

export const recordingAcceptedSchema = z.object({ id: z.uuid() });

/** The column names found in a file, as the refusal listed them: the key a mapping used before is kept under. */
export const savedMappingQuerySchema = z.strictObject({
  headers: plainText({ multiline: true }).max(4000, { error: 'At most 4000 characters' }),
});
/** The mapping last used for a file with the same column names in this programme, if any. */
export const savedMappingSchema = z.object({
  mapping: z
    .object({
      timestampColumn: z.string().optional(), dateColumn: z.string().optional(), timeColumn: z.string().optional(),
      spo2Column: z.string().optional(), pulseColumn: z.string().optional(), statusColumn: z.string().optional(),
      timeFormat: z.enum(RECORDING_TIME_FORMATS).optional(), dateOrder: z.enum(DATE_ORDERS).optional(), timeZone: z.string().optional(),
    })
    .nullable(),
});
export type SavedMapping = z.infer<typeof savedMappingSchema>['mapping'];

/** Doubles as the analysis produced them; the web rounds for display. Null where no valid sample exists. */
export const recordingSummarySchema = z.object({
  validMinutes: z.number(),
  meanSpo2: z.number().nullable(),
  medianSpo2: z.number().nullable(),
  minSpo2: z.number().nullable(),
  pctBelow90: z.number().nullable(),
  pctBelow92: z.number().nullable(),
  pctBelow93: z.number().nullable(),
  odi3: z.number().nullable(),
  odi4: z.number().nullable(),
  meanPulse: z.number().nullable(),
  /** False: less valid time than the programme's minimum — too short to judge, counts for nothing. */
  judged: z.boolean(),
  minValidMinutes: z.number(),
  /** The minimum event duration the events were counted with (programme policy at analysis time). */
  minEventSeconds: z.number(),
});
export type RecordingSummary = z.infer<typeof recordingSummarySchema>;

export const recordingSchema = z.object({
  id: z.uuid(),
  infantId: z.uuid(),
  status: z.enum(RECORDING_STATUSES),
  fileName: z.string(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  byteSize: z.number().int(),
  uploadedAt: z.string(),
  uploadedBy: z.object({ id: z.uuid(), name: z.string() }).nullable(),
  timeFormat: z.enum(['iso', 'seconds']),
  startedAt: z.string().nullable(),
  durationMinutes: z.number(),
  sampleCount: z.number().int(),
  samplePeriodSec: z.number(),
  skippedRows: z.number().int(),
  analysisVersion: z.string().nullable(),
  analysedAt: z.string().nullable(),
  failureReason: z.string().optional(),
  summary: recordingSummarySchema.optional(),
});
export type Recording = z.infer<typeof recordingSchema>;
export const recordingListSchema = pagedSchema(recordingSchema);
export const listRecordingsQuerySchema = pageQuerySchema;

export const recordingTraceSchema = z.object({
  points: z.array(z.object({
    tSec: z.number(), spo2Min: z.number().nullable(), spo2Mean: z.number().nullable(),
    /** Mean pulse per bucket (bpm); absent in answers from before it was added. */
    pulseMean: z.number().nullable().default(null),
  })),
  /** ODI3 events; `deep` marks those that also count for ODI4. Empty until the analysis is done. */
  events: z.array(z.object({ startSec: z.number(), endSec: z.number(), nadir: z.number(), deep: z.boolean() })),
  threshold: z.number(),
});
export type RecordingTrace = z.infer<typeof recordingTraceSchema>;
