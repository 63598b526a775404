import { z } from 'zod';

// C0 and C1 control characters, DEL and lone UTF-16 surrogates: a NUL cannot be stored in PostgreSQL text, and the
// others only hide or reshape what a reader sees. Multi-line text keeps tab, line feed and carriage return.
const CONTROL_ANY = /[\p{Cc}\p{Cs}]/u;
const CONTROL_MULTILINE = /(?![\t\n\r])\p{Cc}|\p{Cs}/u;

/**
 * The one base for every text a person or a client sends (body fields, search parameters, form fields): a string
 * without control characters. Chain trim/min/max/regex after it as usual.
 */
export const plainText = (opts: { multiline?: boolean; error?: string } = {}) =>
  z.string(opts.error ? { error: opts.error } : undefined).refine((s) => !(opts.multiline ? CONTROL_MULTILINE : CONTROL_ANY).test(s), {
    error: opts.multiline ? 'Remove the control characters (only tab and new line are allowed)' : 'Remove the control characters (tab, new line and others are not allowed here)',
    abort: true,
  });

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
    /** The id of the request's access-log line, to quote when reporting a problem. */
    requestId: z.string().optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;

export const pagedSchema = <T extends z.ZodType>(item: T) =>
  z.object({ items: z.array(item), total: z.number().int().nonnegative() });

/**
 * Paging by position (keyset): the opaque cursor of the last row of a page (next) or its first row (prev), from the
 * previous answer. Without a cursor the page number is used.
 */
export const cursorQueryShape = {
  cursor: plainText().trim().max(400).optional(),
  direction: z.enum(['next', 'prev'], { error: 'Direction is next or prev' }).default('next'),
};

/** A page read by position: above 10,000 matching rows the total is PostgreSQL's estimate ("about N"). */
export const cursorPagedSchema = <T extends z.ZodType>(item: T) =>
  pagedSchema(item).extend({
    totalIsEstimate: z.boolean().optional(),
    /** Cursors for the pages after and before this one; null at either end. */
    nextCursor: z.string().nullable().optional(),
    prevCursor: z.string().nullable().optional(),
  });
