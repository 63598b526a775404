import { z } from 'zod';

// The typed catalogue of queues and jobs: the API enqueues through it, the worker parses payloads with it.
export const QUEUES = {
  maintenance: 'maintenance',
  clinical: 'clinical',
} as const;

export const JOBS = {
  pruneSessions: { queue: QUEUES.maintenance, name: 'prune-sessions', payload: z.strictObject({}) },
  reconcileConversions: { queue: QUEUES.maintenance, name: 'reconcile-conversions', payload: z.strictObject({}) },
  convertPrescription: {
    queue: QUEUES.clinical,
    name: 'convert-prescription',
    payload: z.strictObject({ prescriptionId: z.uuid() }),
  },
} as const;

export type JobKey = keyof typeof JOBS;
export type JobPayload<K extends JobKey> = z.infer<(typeof JOBS)[K]['payload']>;

/** One job per prescription version, whatever retries or double clicks happen (BullMQ ids may not contain ':'). */
export const conversionJobId = (prescriptionId: string) => `convert-${prescriptionId}`;
