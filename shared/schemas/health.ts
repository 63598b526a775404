import { z } from 'zod';

export const workerBeatSchema = z.object({ id: z.string(), lastSeen: z.string(), ageSeconds: z.number(), stale: z.boolean() });

/** GET /api/health/ready (and /api/health): can this API serve, and are the workers alive? */
export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded', 'down']),
  db: z.enum(['ok', 'down']),
  redis: z.enum(['ok', 'down']),
  migrations: z.enum(['current', 'pending', 'unknown']),
  workers: z.object({ status: z.enum(['ok', 'missing']), running: z.number().int().nonnegative(), seen: z.array(workerBeatSchema) }),
});
export type Health = z.infer<typeof healthSchema>;

/** GET /api/health/live: the process answers. */
export const liveSchema = z.object({ status: z.literal('ok'), uptimeSeconds: z.number().int().nonnegative() });
