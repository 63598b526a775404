import { z } from 'zod';
import { plainText } from './common';

export const VISIT_KINDS = ['home_visit', 'clinic_review'] as const;
export type VisitKind = (typeof VISIT_KINDS)[number];
export const VISIT_KIND_LABELS: Record<VisitKind, string> = { home_visit: 'Home visit', clinic_review: 'Clinic review' };
export const VISIT_STATUSES = ['booked', 'cancelled', 'done'] as const;
export type VisitStatus = (typeof VISIT_STATUSES)[number];

const date = z.iso.date({ error: 'Use a date like 2026-12-03' });
const time = plainText().regex(/^([01]\d|2[0-3]):[0-5]\d$/, { error: 'Use a time like 09:30' });
const duration = z.number({ error: 'Enter the length in minutes' }).int().min(5, { error: 'At least 5 minutes' }).max(480, { error: 'At most 8 hours' });
const purpose = plainText().trim().min(2, { error: 'Say what the visit is for' }).max(300, { error: 'At most 300 characters' });

/** Date and time are the family's local wall-clock time (their contact's time zone). */
export const bookVisitSchema = z.strictObject({
  kind: z.enum(VISIT_KINDS, { error: 'Choose home visit or clinic review' }),
  date,
  time,
  durationMinutes: duration,
  staffId: z.uuid({ error: 'Choose who will see the family' }),
  purpose,
});
export type BookVisitInput = z.infer<typeof bookVisitSchema>;

export const moveVisitSchema = z.strictObject({
  rowVersion: z.number().int().positive(),
  date: date.optional(),
  time: time.optional(),
  durationMinutes: duration.optional(),
  staffId: z.uuid().optional(),
  purpose: purpose.optional(),
});
export type MoveVisitInput = z.infer<typeof moveVisitSchema>;

/** A booked visit may be marked done from an hour before its booked start (a nurse may be early), never sooner. */
export const mayMarkVisitDone = (startsAt: Date, now: Date): boolean => startsAt.getTime() - now.getTime() <= 3_600_000;

/** A visit that took place as booked (a visit that happened at another time is moved first). */
export const completeVisitSchema = z.strictObject({
  rowVersion: z.number({ error: 'Reload the visit and try again' }).int().positive(),
});

export const cancelVisitSchema = z.strictObject({
  reason: plainText().trim().min(2, { error: 'Say why the visit is cancelled' }).max(300),
});

export const visitSchema = z.object({
  id: z.uuid(),
  infantId: z.uuid(),
  kind: z.enum(VISIT_KINDS),
  startsAt: z.string(),
  date: z.string(),
  time: z.string(),
  timeZone: z.string(),
  durationMinutes: z.number(),
  staff: z.object({ id: z.uuid(), name: z.string() }),
  purpose: z.string(),
  status: z.enum(VISIT_STATUSES),
  cancelReason: z.string().nullable(),
  rowVersion: z.number(),
});
export type Visit = z.infer<typeof visitSchema>;
export const visitListSchema = z.object({ items: z.array(visitSchema) });
