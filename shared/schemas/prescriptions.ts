import { z } from 'zod';
import { conversionPreviewResponseSchema } from './conversions';

export const PRESCRIPTION_STATUSES = ['preparing', 'proposed', 'active', 'superseded', 'rejected', 'withdrawn'] as const;
export type PrescriptionStatus = (typeof PRESCRIPTION_STATUSES)[number];
export const PRESCRIPTION_STATUS_LABELS: Record<PrescriptionStatus, string> = {
  preparing: 'Being worked out',
  proposed: 'Waiting for sign-off',
  active: 'Current plan',
  superseded: 'Replaced',
  rejected: 'Sent back',
  withdrawn: 'Withdrawn (newer proposal)',
};

export const PRESCRIPTION_REASONS = ['enrolment', 'weight', 'home_location', 'home_source', 'manual', 'step_down', 'step_up', 'leave_programme'] as const;
export type PrescriptionReason = (typeof PRESCRIPTION_REASONS)[number];
export const PRESCRIPTION_REASON_LABELS: Record<(typeof PRESCRIPTION_REASONS)[number], string> = {
  enrolment: 'Enrolment',
  weight: 'Weight changed',
  home_location: 'Home elevation or pressure changed',
  home_source: 'Home oxygen source changed',
  manual: 'Asked for by staff',
  step_down: 'Step down',
  step_up: 'Step back up',
  leave_programme: 'Leave the programme',
};

export const periodsSchema = z.strictObject({
  awake: z.number().min(0).max(15),
  asleep: z.number().min(0).max(15),
  feeding: z.number().min(0).max(15),
});

const person = z.object({ id: z.uuid(), name: z.string() }).nullable();

export const prescriptionSchema = z.object({
  id: z.uuid(),
  infantId: z.uuid(),
  version: z.number().int(),
  status: z.enum(PRESCRIPTION_STATUSES),
  reason: z.enum(PRESCRIPTION_REASONS),
  input: z.record(z.string(), z.unknown()),
  conversion: conversionPreviewResponseSchema.nullable(),
  computedAt: z.string().nullable(),
  requiredFlowLpm: z.number().nullable(),
  proposedFlowLpm: z.number().nullable(),
  approvedFlowLpm: z.number().nullable(),
  approvedFio2: z.number().nullable(),
  source: z.string(),
  sourceO2Percent: z.number(),
  periods: periodsSchema.nullable(),
  evidence: z.record(z.string(), z.unknown()).nullable().optional(),
  decidedBy: person,
  decidedAt: z.string().nullable(),
  decisionReason: z.string().nullable(),
  createdAt: z.string(),
});
export type Prescription = z.infer<typeof prescriptionSchema>;
export const prescriptionListSchema = z.object({ items: z.array(prescriptionSchema) });

export const decisionSchema = z
  .strictObject({
    decision: z.enum(['approve', 'reject'], { error: 'Choose approve or reject' }),
    flowLpm: z.number().positive({ error: 'Flow must be above 0 L/min' }).max(15).optional(),
    reason: z.string().trim().max(1000).optional(),
    periods: periodsSchema.optional(),
  })
  .superRefine((d, ctx) => {
    if (d.decision === 'reject' && !d.reason) ctx.addIssue({ code: 'custom', path: ['reason'], message: 'Say why the setting is sent back' });
  });
export type DecisionInput = z.infer<typeof decisionSchema>;

export const queueItemSchema = z.object({
  prescriptionId: z.uuid(),
  infantId: z.uuid(),
  infantName: z.string(),
  correctedAge: z.string(),
  homeElevationM: z.number().nullable(),
  homePressureMmHg: z.number(),
  siteName: z.string(),
  reason: z.enum(PRESCRIPTION_REASONS),
  proposedFlowLpm: z.number().nullable(),
  feasible: z.boolean(),
  warningCount: z.number().int(),
  /** Step downs: how many of the programme's rules were not met when it was asked for. */
  unmetChecks: z.number().int(),
  waitingSince: z.string(),
});
export const queueSchema = z.object({ items: z.array(queueItemSchema) });
export type QueueItem = z.infer<typeof queueItemSchema>;
