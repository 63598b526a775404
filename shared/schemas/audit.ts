import { z } from 'zod';
import { READ_ACTIONS } from '../audit/audit-actions';
import { plainText, uuidSchema } from './common';

const day = z.iso.date({ error: 'Use a date like 2026-12-03' });

/** "Who looked at this baby's record": filter by person and by day (inclusive, in UTC), newest first, a page at a time. */
export const readLogQuerySchema = z.strictObject({
  actorId: uuidSchema.optional(),
  from: day.optional(),
  to: day.optional(),
  cursor: plainText().max(400).optional(),
  limit: z.coerce.number().int().min(1).max(100, { error: 'At most 100 rows a page' }).default(50),
}).refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], error: 'The end date must be on or after the start date' });
export type ReadLogQuery = z.infer<typeof readLogQuerySchema>;

export const readLogEntrySchema = z.object({
  id: z.string(),
  at: z.string(),
  action: z.enum(READ_ACTIONS),
  words: z.string(),
  person: z.object({ id: z.uuid(), name: z.string(), role: z.string() }).nullable(),
  ip: z.string().nullable(),
});
export const readLogPageSchema = z.object({
  items: z.array(readLogEntrySchema),
  /** Pass back as `cursor` for the next (older) page; null on the last page. */
  nextCursor: z.string().nullable(),
});
export type ReadLogEntry = z.infer<typeof readLogEntrySchema>;
export type ReadLogPage = z.infer<typeof readLogPageSchema>;

/** One verification of the programme's audit hash chain. */
export const chainCheckSchema = z.object({
  id: z.string(),
  checkedAt: z.string(),
  /** Null when the scheduled job ran it. */
  checkedBy: z.string().nullable(),
  ok: z.boolean(),
  rowsChecked: z.number().int().nonnegative(),
  /** The first broken link, when there is one. */
  broken: z.object({ rowId: z.string().nullable(), rowAt: z.string().nullable(), seq: z.number().int(), problem: z.string() }).nullable(),
});
export type ChainCheck = z.infer<typeof chainCheckSchema>;
export const chainChecksSchema = z.object({ items: z.array(chainCheckSchema) });
