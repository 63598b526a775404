import { z } from 'zod';

// The typed catalogue of queues and jobs: the API enqueues through it, the worker parses payloads with it.
export const QUEUES = {
  maintenance: 'maintenance',
} as const;

export const JOBS = {
  pruneSessions: { queue: QUEUES.maintenance, name: 'prune-sessions', payload: z.strictObject({}) },
} as const;

export type JobKey = keyof typeof JOBS;
export type JobPayload<K extends JobKey> = z.infer<(typeof JOBS)[K]['payload']>;
