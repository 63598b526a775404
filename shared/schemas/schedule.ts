import { z } from 'zod';

export const CHECK_KINDS = ['spot_check', 'overnight_study', 'room_air_challenge', 'step_down_review'] as const;
export type CheckKind = (typeof CHECK_KINDS)[number];
export const CHECK_KIND_LABELS: Record<CheckKind, string> = {
  spot_check: 'Spot check',
  overnight_study: 'Overnight study',
  room_air_challenge: 'Room-air challenge',
  step_down_review: 'Step-down review',
};
export const CHECK_STATUSES = ['planned', 'overdue', 'done', 'cancelled'] as const;
export type CheckStatus = (typeof CHECK_STATUSES)[number];

export const checkSchema = z.object({
  id: z.uuid(),
  infantId: z.uuid(),
  kind: z.enum(CHECK_KINDS),
  planKey: z.string(),
  dueAt: z.string(),
  dueDate: z.string(),
  status: z.enum(CHECK_STATUSES),
  doneAt: z.string().nullable(),
  /** e.g. a repeat is needed because the last study was too short to judge. */
  note: z.string().nullable().optional(),
});
export type Check = z.infer<typeof checkSchema>;
export const scheduleResponseSchema = z.object({ upcoming: z.array(checkSchema), overdue: z.array(checkSchema), done: z.array(checkSchema) });

export const dayItemSchema = checkSchema.extend({
  infantName: z.string(),
  homeAddress: z.string(),
  activeFlowLpm: z.number().nullable(),
  correctedAge: z.string(),
});
/** A visit booked for the signed-in nurse today (family's local date and time). */
export const dayVisitSchema = z.object({
  id: z.uuid(),
  infantId: z.uuid(),
  infantName: z.string(),
  homeAddress: z.string(),
  kind: z.enum(['home_visit', 'clinic_review']),
  date: z.string(),
  time: z.string(),
  startsAt: z.string(),
  durationMinutes: z.number(),
  purpose: z.string(),
});
export type DayVisit = z.infer<typeof dayVisitSchema>;

export const myDaySchema = z.object({
  date: z.string(),
  /** Due today or overdue, in route order. */
  items: z.array(dayItemSchema),
  /** Due in the next seven days, by date: what the round will bring (follow-up studies after a step down, etc.). */
  upcoming: z.array(dayItemSchema).default([]),
  /** Visits booked with the signed-in person today, by start time. */
  visits: z.array(dayVisitSchema).default([]),
});
export type DayItem = z.infer<typeof dayItemSchema>;
export type MyDay = z.infer<typeof myDaySchema>;
