import { z } from 'zod';

export const uuidSchema = z.uuid({ error: 'Must be a valid id' });
export const idParamsSchema = z.strictObject({ id: uuidSchema });

export const pageQuerySchema = z.strictObject({
  page: z.coerce.number().int().min(1, { error: 'Page starts at 1' }).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, { error: 'At most 100 rows a page' }).default(25),
});

export const errorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    // Per-field messages (400, 422 needs_confirmation), or the unmet rules of a 422 policy_not_met.
    details: z.record(z.string(), z.union([z.array(z.string()), z.array(z.object({ code: z.string(), message: z.string() }))])).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;

export const pagedSchema = <T extends z.ZodType>(item: T) =>
  z.object({ items: z.array(item), total: z.number().int().nonnegative() });
