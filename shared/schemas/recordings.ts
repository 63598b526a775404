import { z } from 'zod';
import { pageQuerySchema, pagedSchema, plainText } from './common';
import { RECORDING_TIME_FORMATS } from '../recordings/limits';

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

/** Form fields sent beside the file: a column mapping for exports not in our own format. */
export const recordingUploadFieldsSchema = z
  .strictObject({
    timestampColumn: columnName.optional(),
    spo2Column: columnName.optional(),
    pulseColumn: columnName.optional(),
    statusColumn: columnName.optional(),
    timeFormat: z.enum(RECORDING_TIME_FORMATS, { error: 'Choose iso, seconds, local or auto' }).default('auto'),
  })
  .superRefine((f, ctx) => {
    const chosen = (['timestampColumn', 'spo2Column', 'pulseColumn', 'statusColumn'] as const).filter((k) => f[k] !== undefined);
    const seen = new Map<string, string>();
    for (const k of chosen) {
      const name = f[k]!.toLowerCase();
      if (seen.has(name)) ctx.addIssue({ code: 'custom', path: [k], message: `The same column is already chosen for ${seen.get(name)}` });
      else seen.set(name, k);
    }
  });
export type RecordingUploadFields = z.infer<typeof recordingUploadFieldsSchema>;

export const recordingAcceptedSchema = z.object({ id: z.uuid() });

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
  points: z.array(z.object({ tSec: z.number(), spo2Min: z.number().nullable(), spo2Mean: z.number().nullable() })),
  /** ODI3 events; `deep` marks those that also count for ODI4. Empty until the analysis is done. */
  events: z.array(z.object({ startSec: z.number(), endSec: z.number(), nadir: z.number(), deep: z.boolean() })),
  threshold: z.number(),
});
export type RecordingTrace = z.infer<typeof recordingTraceSchema>;
