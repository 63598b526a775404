import { z } from 'zod';
import { plainText } from './common';
import { DISCHARGE_EVIDENCE, DISCHARGE_GROUPS } from './discharge-policy';
import { ORDER_STATUSES } from './equipment-orders';

const isoDate = z.iso.date({ error: 'Use a date like 2026-12-03' });

/** The evidence stored with a ticked item: the day it was done and who did it. */
export const dischargeEvidenceSchema = z.strictObject({
  date: isoDate.optional(),
  person: plainText().trim().min(2, { error: 'Say who did it' }).max(120, { error: 'At most 120 characters' }).optional(),
});
export type DischargeEvidence = z.infer<typeof dischargeEvidenceSchema>;

export const updateDischargeItemSchema = z.strictObject({
  done: z.boolean({ error: 'Say whether it is done' }),
  note: plainText({ multiline: true }).trim().max(500, { error: 'At most 500 characters' }).optional(),
  evidence: dischargeEvidenceSchema.optional(),
});
export type UpdateDischargeItemInput = z.infer<typeof updateDischargeItemSchema>;

export const dischargeItemParamsSchema = z.strictObject({
  id: z.uuid({ error: 'Must be a valid id' }),
  // Any code is looked up in the programme's checklist: one it does not have is 404, not a field error.
  key: plainText().min(1).max(60, { error: 'Unknown checklist item' }),
});

export const setDischargeSchema = z.strictObject({
  date: isoDate,
  /** Only a consultant may set the date with the checklist incomplete or the setting not approved, and says why. */
  overrideReason: plainText({ multiline: true }).trim().min(5, { error: 'Say why the baby goes home before everything is done' })
    .max(500, { error: 'At most 500 characters' }).optional(),
});
export type SetDischargeInput = z.infer<typeof setDischargeSchema>;

export const emailLetterSchema = z.strictObject({
  to: plainText().trim().max(254).pipe(z.email({ error: 'Enter an e-mail address like gp@example.org' })),
});
export type EmailLetterInput = z.infer<typeof emailLetterSchema>;

/** The answer to POST /infants/:id/discharge-letter/email once the mail server has taken the letter. */
export const letterSentSchema = z.object({ sentTo: z.string(), filename: z.string() });

const person = z.object({ id: z.uuid(), name: z.string() });

export const dischargeItemSchema = z.object({
  key: z.string(),
  label: z.string(),
  group: z.enum(DISCHARGE_GROUPS),
  /** The evidence this item needs before it can be ticked. */
  evidenceNeeded: z.array(z.enum(DISCHARGE_EVIDENCE)),
  source: z.string(),
  done: z.boolean(),
  doneBy: person.nullable(),
  doneAt: z.string().nullable(),
  note: z.string(),
  evidence: z.object({ date: z.string().optional(), person: z.string().optional() }).nullable(),
  /**
   * Set when the baby's equipment order, not a person, has done the item (equipment ordered / installed): the order,
   * its status now, and whether it was sent or delivered on the programme's day `on`. A hand tick, when there is one, stands instead.
   * Left out of the family's view, which says nothing about orders.
   */
  byOrder: z.object({ event: z.enum(['sent', 'delivered']), orderId: z.uuid(), reference: z.string(), status: z.enum(ORDER_STATUSES), on: z.string() }).nullable().optional(),
});
export type DischargeItem = z.infer<typeof dischargeItemSchema>;

export const dischargeSchema = z.object({
  items: z.array(dischargeItemSchema),
  /** The plan is approved and every item ticked. */
  ready: z.boolean(),
  /** What still stands between the baby and a discharge date: item keys, and `setting_approved` first when it applies. */
  missing: z.array(z.string()),
  settingApproved: z.boolean(),
  dischargedOn: z.string().nullable(),
  /** Set when a consultant set the date with something missing. */
  override: z.object({ reason: z.string(), by: person.nullable(), missing: z.array(z.string()) }).nullable(),
  /**
   * The nurse's first home visit, proposed at the policy's interval after discharge until someone books it; then the
   * earliest home visit booked on or after the discharge date (`bookedVisitId`, on `visitOn`).
   */
  firstVisit: z.object({ proposedOn: z.string(), bookedVisitId: z.uuid().nullable(), visitOn: z.string().nullable() }).nullable(),
});
export type Discharge = z.infer<typeof dischargeSchema>;
