import { z } from 'zod';
import { STEP_DOWN_RULE_CODES } from '../schedule/step-down-rules';
import { INFANT_FLAGS } from './infants';
import { READING_STATES } from './readings';

export const stepDownRequestSchema = z.strictObject({
  reason: z.string().trim().min(3, { error: 'Say why the baby is ready to step down' }).max(1000, { error: 'At most 1000 characters' }),
  /** Needed when a programme rule is not met: why the step down should go ahead anyway (recorded and audited). */
  overrideReason: z.string().trim().min(10, { error: 'Say in at least 10 characters why the step down should go ahead anyway' }).max(1000, { error: 'At most 1000 characters' }).optional(),
});
export type StepDownRequestInput = z.infer<typeof stepDownRequestSchema>;

export const ruleCheckSchema = z.object({ code: z.enum(STEP_DOWN_RULE_CODES), met: z.boolean(), message: z.string() });
export type RuleCheckDto = z.infer<typeof ruleCheckSchema>;

export const studyEvidenceSchema = z.object({
  recordingId: z.uuid(),
  recordedAt: z.string(),
  validMinutes: z.number(),
  meanSpo2: z.number().nullable(),
  pctBelow90: z.number().nullable(),
  odi3: z.number().nullable(),
  odi4: z.number().nullable(),
  judged: z.boolean(),
});

export const readingEvidenceSchema = z.object({
  takenAt: z.string(), spo2: z.number(), pulse: z.number().nullable(), state: z.enum(READING_STATES), familyReported: z.boolean(),
});

/** What the decider sees with a step-down proposal; stored with the proposal as it was when asked for. */
export const stepDownEvidenceSchema = z.object({
  kind: z.enum(['lower', 'sleep_only', 'off']).optional(),
  label: z.string().optional(),
  checks: z.array(ruleCheckSchema),
  study: studyEvidenceSchema.nullable(),
  readings: z.array(readingEvidenceSchema),
  flags: z.array(z.enum(INFANT_FLAGS)),
  requestedBy: z.object({ id: z.uuid(), name: z.string() }).nullable(),
  reason: z.string().nullable(),
  overrideReason: z.string().nullable(),
});
export type StepDownEvidence = z.infer<typeof stepDownEvidenceSchema>;

/** The nurse's form asks for these before sending: every rule met or not, and the step that would be proposed. */
export const stepDownPreviewSchema = z.object({
  next: z.object({ kind: z.enum(['lower', 'sleep_only', 'off']), label: z.string(), flowLpm: z.number() }).nullable(),
  checks: z.array(ruleCheckSchema),
  blockedReason: z.string().nullable(),
});
export type StepDownPreview = z.infer<typeof stepDownPreviewSchema>;
