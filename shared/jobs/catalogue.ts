import { z } from 'zod';

// The typed catalogue of queues and jobs: the API enqueues through it, the worker parses payloads with it.
export const QUEUES = {
  maintenance: 'maintenance',
  clinical: 'clinical',
  planning: 'planning',
  messages: 'messages',
} as const;

export const JOBS = {
  pruneSessions: { queue: QUEUES.maintenance, name: 'prune-sessions', payload: z.strictObject({}) },
  reconcileConversions: { queue: QUEUES.maintenance, name: 'reconcile-conversions', payload: z.strictObject({}) },
  convertPrescription: {
    queue: QUEUES.clinical,
    name: 'convert-prescription',
    payload: z.strictObject({ prescriptionId: z.uuid() }),
  },
  planInfant: { queue: QUEUES.planning, name: 'plan-infant', payload: z.strictObject({ infantId: z.uuid() }) },
  replanProgramme: {
    queue: QUEUES.planning,
    name: 'replan-programme',
    payload: z.strictObject({ programmeId: z.uuid(), policyVersion: z.number().int() }),
  },
  markOverdue: { queue: QUEUES.maintenance, name: 'mark-overdue', payload: z.strictObject({}) },
  deliverReminder: { queue: QUEUES.messages, name: 'deliver-reminder', payload: z.strictObject({ reminderId: z.uuid() }) },
  reconcileReminders: { queue: QUEUES.maintenance, name: 'reconcile-reminders', payload: z.strictObject({}) },
  planDigests: { queue: QUEUES.maintenance, name: 'plan-digests', payload: z.strictObject({}) },
  analyseRecording: { queue: QUEUES.clinical, name: 'analyse-recording', payload: z.strictObject({ recordingId: z.uuid() }) },
  /** Recordings analysed by an older version of the rules are analysed again, a batch at a time. */
  reanalyseRecordings: { queue: QUEUES.maintenance, name: 'reanalyse-recordings', payload: z.strictObject({}) },
  /** Every audit hash chain walked end to end; a broken one is recorded, logged and e-mailed to the admins. */
  verifyAuditChain: { queue: QUEUES.maintenance, name: 'verify-audit-chain', payload: z.strictObject({}) },
} as const;

export type JobKey = keyof typeof JOBS;
export type JobPayload<K extends JobKey> = z.infer<(typeof JOBS)[K]['payload']>;

/** One job per prescription version, whatever retries or double clicks happen (BullMQ ids may not contain ':'). */
export const conversionJobId = (prescriptionId: string) => `convert-${prescriptionId}`;

/** A programme re-plan runs once per policy version. */
export const replanJobId = (programmeId: string, policyVersion: number) => `replan-${programmeId}-v${policyVersion}`;
/** While a baby's re-plan waits, further requests fold into it (BullMQ de-duplication). */
export const planDedupId = (infantId: string) => `plan-${infantId}`;
/** One analysis per uploaded recording, whatever retries, reconciles or double sends happen. */
export const recordingJobId = (recordingId: string) => `analyse-${recordingId}`;
/** The reminder id is the job id: re-adding a reminder while its job waits, runs or retries is a no-op. */
export const reminderJobId = (reminderId: string) => reminderId;
