import { z } from 'zod';

export const READING_STATES = ['awake', 'asleep', 'feeding', 'crying'] as const;
export const READING_STATE_LABELS: Record<(typeof READING_STATES)[number], string> = {
  awake: 'Awake', asleep: 'Asleep', feeding: 'Feeding', crying: 'Crying',
};

const reading = {
  takenAt: z.iso.datetime({ offset: true, error: 'Give the time the reading was taken' }),
  spo2: z.number({ error: 'Enter the SpO2 %' }).int({ error: 'Whole numbers only' }).min(50, { error: 'SpO2 must be 50–100 %' }).max(100, { error: 'SpO2 must be 50–100 %' }),
  pulse: z.number({ error: 'Enter the pulse' }).int({ error: 'Whole numbers only' }).min(40, { error: 'Pulse must be 40–250 /min' }).max(250, { error: 'Pulse must be 40–250 /min' }).optional(),
  flowLpm: z.number({ error: 'Enter the flow in L/min' }).min(0, { error: 'Flow cannot be negative' }).max(15, { error: 'At most 15 L/min' }).optional(),
  state: z.enum(READING_STATES, { error: 'Choose awake, asleep, feeding or crying' }),
  notes: z.string().trim().max(1000, { error: 'At most 1000 characters' }).optional(),
};

export const createReadingSchema = z.strictObject({
  ...reading,
  /** Weight in kg; checked against the baby's last weight on the server. */
  weightKg: z.number({ error: 'Enter the weight in kg' }).min(0.3, { error: 'At least 0.3 kg' }).max(15, { error: 'At most 15 kg' }).optional(),
  /** The person has checked an unusual weight (under 1 kg, or > 20 % from a weight within 14 days). */
  weightConfirmed: z.boolean().optional(),
  /** The planned check this reading completes, when logged from the nurse's day. */
  checkId: z.uuid().optional(),
});
export type CreateReadingInput = z.infer<typeof createReadingSchema>;

export const updateReadingSchema = z.strictObject({
  spo2: reading.spo2.optional(),
  pulse: reading.pulse,
  flowLpm: reading.flowLpm,
  state: reading.state.optional(),
  notes: reading.notes,
});
export type UpdateReadingInput = z.infer<typeof updateReadingSchema>;

export const readingsQuerySchema = z.strictObject({
  from: z.iso.datetime({ offset: true }).optional(),
  to: z.iso.datetime({ offset: true }).optional(),
});

export const readingSchema = z.object({
  id: z.uuid(),
  infantId: z.uuid(),
  checkId: z.uuid().nullable(),
  takenAt: z.string(),
  spo2: z.number(),
  pulse: z.number().nullable(),
  flowLpm: z.number().nullable(),
  state: z.enum(READING_STATES),
  weightKg: z.number().nullable(),
  notes: z.string().nullable(),
  familyReported: z.boolean(),
  createdBy: z.object({ id: z.uuid(), name: z.string() }),
  createdAt: z.string(),
  editableUntil: z.string().nullable(),
});
export type Reading = z.infer<typeof readingSchema>;
export const readingListSchema = z.object({ items: z.array(readingSchema) });
