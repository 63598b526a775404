import { z } from 'zod';

// The server stores the evidence of a step proposal as an open record (Prescription.evidence). These are the fields
// it writes today (server/modules/step-downs); each is optional so an older or newer proposal still shows what it has.
export const stepEvidenceSchema = z.object({
  recordingId: z.uuid().optional(),
  meanSpo2: z.number().nullable().optional(),
  pctBelow90: z.number().nullable().optional(),
  validMinutes: z.number().optional(),
  targetMet: z.boolean().optional(),
  shortfalls: z.array(z.string()).optional(),
  kind: z.string().optional(),
  label: z.string().optional(),
  requestReason: z.string().optional(),
  /** Newer proposals: the reason given, the reason to ask against unmet rules, and how many rules were unmet. */
  reason: z.string().nullable().optional(),
  overrideReason: z.string().nullable().optional(),
  checks: z.array(z.object({ met: z.boolean() })).optional(),
  observedDays: z.number().optional(),
});
export type StepEvidence = z.infer<typeof stepEvidenceSchema>;

export const STEP_REASONS = ['step_down', 'step_up', 'leave_programme'] as const;

export function readEvidence(evidence: unknown): StepEvidence | null {
  const parsed = stepEvidenceSchema.safeParse(evidence);
  return parsed.success ? parsed.data : null;
}
