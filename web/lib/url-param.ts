import type { z } from 'zod';

/**
 * Reads one parameter of a list view from the address bar. Each parameter falls back on its own, so one bad
 * value in a shared link does not reset the whole view.
 */
export function readParam<T>(schema: z.ZodType<T>, raw: string | null, fallback: T): T {
  const result = schema.safeParse(raw ?? undefined);
  return result.success ? result.data : fallback;
}
