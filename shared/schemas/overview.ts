import { z } from 'zod';
import { ROLES } from '../auth/roles';
import { INFANT_STATUSES } from './infants';

/** How many are waiting, and since when the longest has waited (null when none is). */
export const waitingSchema = z.object({ count: z.number().int().nonnegative(), oldestSince: z.string().nullable() });
export type Waiting = z.infer<typeof waitingSchema>;

/** One calendar month in the programme's time zone (YYYY-MM) and the babies on home oxygen at any time in it. */
export const monthCountSchema = z.object({ month: z.string().regex(/^\d{4}-\d{2}$/), count: z.number().int().nonnegative() });
export type MonthCount = z.infer<typeof monthCountSchema>;
export const ON_OXYGEN_MONTHS = 12;

export const journeyWaitingItemSchema = z.object({
  id: z.uuid(),
  infantName: z.string(),
  destinationName: z.string(),
  departOn: z.string(),
  waitingSince: z.string(),
});
export type JourneyWaitingItem = z.infer<typeof journeyWaitingItemSchema>;
/** The coordinator's overview names the oldest few waiting journey checks; the count covers them all. */
export const JOURNEYS_LISTED = 5;

export const dischargeListItemSchema = z.object({
  infantId: z.uuid(),
  infantName: z.string(),
  /** Null while the baby is still being prepared. */
  dischargedOn: z.string().nullable(),
  /** What is still missing, as checklist keys (with `setting_approved` when it applies) and their labels. */
  missing: z.array(z.object({ key: z.string(), label: z.string() })),
});
export type DischargeListItem = z.infer<typeof dischargeListItemSchema>;
/** The coordinator's overview lists this many babies going home; the counts cover them all. */
export const DISCHARGES_LISTED = 20;

export const coordinatorOverviewSchema = z.object({
  role: z.literal('coordinator'),
  asOf: z.string(),
  /** Every status, in the programme's order, zeros included. */
  babiesByStatus: z.array(z.object({ status: z.enum(INFANT_STATUSES), count: z.number().int().nonnegative() })),
  /** Settings proposed and not yet decided by a consultant. */
  signOff: waitingSchema,
  /** Open checks whose due time has passed, and how many babies they belong to. */
  overdueChecks: z.object({ count: z.number().int().nonnegative(), babies: z.number().int().nonnegative() }),
  /** Messages that need someone: failed, or sent with an outcome nobody could confirm. */
  messagesNeedingAction: z.object({ failed: z.number().int().nonnegative(), unknown: z.number().int().nonnegative() }),
  journeysWaiting: waitingSchema.extend({ oldest: z.array(journeyWaitingItemSchema).max(JOURNEYS_LISTED) }),
  /** Babies with a discharge date from today on, or with checklist work under way and no date yet. */
  discharges: z.object({
    withDate: z.number().int().nonnegative(),
    preparing: z.number().int().nonnegative(),
    babies: z.array(dischargeListItemSchema).max(DISCHARGES_LISTED),
  }),
  onOxygenByMonth: z.array(monthCountSchema).length(ON_OXYGEN_MONTHS),
  // Equipment orders (issue 16): e-mails to the supplier that failed, and orders not confirmed by the date needed.
  equipmentOrders: z.object({ failed: z.number().int().nonnegative(), unconfirmed: z.number().int().nonnegative() }),
});
export type CoordinatorOverview = z.infer<typeof coordinatorOverviewSchema>;

export const adminOverviewSchema = z.object({
  role: z.literal('admin'),
  asOf: z.string(),
  /** Every role, zeros included: accounts that can sign in, and disabled ones. */
  people: z.array(z.object({ role: z.enum(ROLES), active: z.number().int().nonnegative(), disabled: z.number().int().nonnegative() })),
  /** Version 0 (savedAt null) is the built-in defaults: nobody has saved settings yet. */
  policy: z.object({ version: z.number().int().nonnegative(), savedAt: z.string().nullable() }),
  /** Messages due since Monday 00:00 in the programme's time zone, by what happened to them. */
  messagesThisWeek: z.object({
    since: z.string(),
    sent: z.number().int().nonnegative(),
    failed: z.number().int().nonnegative(),
    unknown: z.number().int().nonnegative(),
  }),
  onOxygenByMonth: z.array(monthCountSchema).length(ON_OXYGEN_MONTHS),
});
export type AdminOverview = z.infer<typeof adminOverviewSchema>;

export const unmetStepDownSchema = z.object({
  prescriptionId: z.uuid(),
  infantName: z.string(),
  unmetRules: z.number().int().positive(),
  waitingSince: z.string(),
});
export type UnmetStepDown = z.infer<typeof unmetStepDownSchema>;

export const consultantOverviewSchema = z.object({
  role: z.literal('consultant'),
  asOf: z.string(),
  proposals: waitingSchema,
  journeys: waitingSchema,
  /** Step-down proposals waiting whose rule checks, as stored with them, include one not met; oldest first. */
  unmetStepDowns: z.array(unmetStepDownSchema),
});
export type ConsultantOverview = z.infer<typeof consultantOverviewSchema>;

/** GET /api/overview answers the view of the caller's own role. */
export const overviewSchema = z.discriminatedUnion('role', [coordinatorOverviewSchema, adminOverviewSchema, consultantOverviewSchema]);
export type Overview = z.infer<typeof overviewSchema>;
