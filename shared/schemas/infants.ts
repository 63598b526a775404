import { z } from 'zod';
import { pageQuerySchema, pagedSchema, plainText } from './common';
import { pressureSourceSchema } from './conversions';

export const DIAGNOSES = ['chronic_lung_disease', 'pulmonary_hypertension', 'heart_disease', 'airway', 'other'] as const;
export const DIAGNOSIS_LABELS: Record<(typeof DIAGNOSES)[number], string> = {
  chronic_lung_disease: 'Chronic lung disease',
  pulmonary_hypertension: 'Pulmonary hypertension',
  heart_disease: 'Heart disease',
  airway: 'Airway problem',
  other: 'Other',
};

export const INFANT_STATUSES = ['preparing', 'awaiting_signoff', 'sent_back', 'on_oxygen', 'stepping_down', 'off_oxygen', 'left_programme'] as const;
export type InfantStatus = (typeof INFANT_STATUSES)[number];
export const INFANT_STATUS_LABELS: Record<InfantStatus, string> = {
  preparing: 'Working out setting',
  awaiting_signoff: 'Waiting for sign-off',
  sent_back: 'Setting sent back',
  on_oxygen: 'On home oxygen',
  stepping_down: 'Stepping down',
  off_oxygen: 'Off oxygen, observing',
  left_programme: 'Left the programme',
};

export const INFANT_FLAGS = ['growth_drift', 'new_setting_waiting', 'not_reachable_by_cannula', 'above_cannula_limit', 'check_overdue', 'below_target', 'number_unreadable'] as const;
export type InfantFlag = (typeof INFANT_FLAGS)[number];
export const INFANT_FLAG_LABELS: Record<InfantFlag, string> = {
  growth_drift: 'Outgrowing flow',
  new_setting_waiting: 'New setting waiting',
  not_reachable_by_cannula: 'Cannula cannot reach target',
  above_cannula_limit: 'Above cannula limit',
  check_overdue: 'Check overdue',
  below_target: 'Below SpO2 target',
  // Set by the move to E.164 numbers for a family number it could not read; cleared when the contacts are saved again.
  number_unreadable: 'Family number unreadable',
};

/**
 * Clinical flags are about the baby's oxygen and need a clinician's eye; administrative ones are work waiting
 * (a sign-off, an overdue check). Screens tell them apart by icon and words, never by colour alone.
 */
export type InfantFlagKind = 'clinical' | 'admin';
export const INFANT_FLAG_KINDS: Record<InfantFlag, InfantFlagKind> = {
  growth_drift: 'clinical',
  new_setting_waiting: 'admin',
  not_reachable_by_cannula: 'clinical',
  above_cannula_limit: 'clinical',
  check_overdue: 'admin',
  below_target: 'clinical',
  number_unreadable: 'admin',
};
export const INFANT_FLAG_KIND_LABELS: Record<InfantFlagKind, string> = { clinical: 'Clinical', admin: 'To do' };

const isoDate = z.iso.date({ error: 'Use a date like 2026-11-30' });
/** A required line of text, with an "Enter the …" message naming it. */
export const requiredText = (label: string, max = 120) =>
  plainText().trim().min(1, { error: `Enter the ${label}` }).max(max, { error: `At most ${max} characters` });

// The contact and enrolment schemas read phone numbers (libphonenumber-js's metadata, the largest library in the web
// app), so they live in ./infant-contacts: a page that only lists or shows babies does not download it.
export type { ContactInput, EnrolInfantFormValues, EnrolInfantInput } from './infant-contacts';

export const hospitalSettingSchema = z
  .strictObject({
    siteId: z.uuid({ error: 'Choose the hospital site' }),
    flowLpm: z.number({ error: 'Enter the flow in L/min' }).min(0.01, { error: 'Flow must be above 0 L/min' }).max(15, { error: 'Flow must be at most 15 L/min' }),
    source: z.enum(['cylinder', 'concentrator', 'blended'], { error: 'Choose the oxygen source' }),
    o2Percent: z.number({ error: 'Enter the oxygen %' }).min(21, { error: 'At least 21 %' }).max(100, { error: 'At most 100 %' }),
  })
  .superRefine((h, ctx) => {
    if (h.source === 'cylinder' && h.o2Percent !== 100) ctx.addIssue({ code: 'custom', path: ['o2Percent'], message: 'Cylinder and wall oxygen is 100 %' });
  });

export const homeSettingSchema = z
  .strictObject({
    address: requiredText('home address', 300),
    location: pressureSourceSchema,
    source: z.enum(['cylinder', 'concentrator'], { error: 'Choose the home oxygen source' }),
    o2Percent: z.number({ error: 'Enter the oxygen %' }).min(21, { error: 'At least 21 %' }).max(100, { error: 'At most 100 %' }),
  })
  .superRefine((h, ctx) => {
    if (h.source === 'cylinder' && h.o2Percent !== 100) ctx.addIssue({ code: 'custom', path: ['o2Percent'], message: 'Cylinder oxygen is 100 %' });
  });

export const babySchema = z.strictObject({
  givenName: requiredText('given name', 80),
  familyName: requiredText('family name', 80),
  sex: z.enum(['female', 'male', 'unknown'], { error: 'Choose one' }),
  birthDate: isoDate,
  gestation: z.strictObject({
    weeks: z.number({ error: 'Enter the completed weeks' }).int({ error: 'Whole weeks' }).min(22, { error: '22 to 44 weeks' }).max(44, { error: '22 to 44 weeks' }),
    days: z.number({ error: 'Enter the days (0 to 6)' }).int({ error: 'Whole days' }).min(0, { error: '0 to 6 days' }).max(6, { error: '0 to 6 days' }),
  }),
  birthWeightG: z.number({ error: 'Enter the birth weight in grams' }).int().min(300, { error: 'At least 300 g' }).max(6500, { error: 'At most 6500 g' }),
  weightKg: z.number({ error: 'Enter the weight in kg' }).min(0.3, { error: 'At least 0.3 kg' }).max(15, { error: 'At most 15 kg' }),
  weightDate: isoDate,
  /** The person has checked an unusual weight (under 1 kg, or > 20 % from a weight within 14 days). */
  weightConfirmed: z.boolean().optional(),
  diagnoses: z.array(z.enum(DIAGNOSES)).max(DIAGNOSES.length).default([]),
});

export const updateInfantSchema = z
  .strictObject({
    rowVersion: z.number().int().positive(),
    weightKg: babySchema.shape.weightKg.optional(),
    weightDate: isoDate.optional(),
    weightConfirmed: z.boolean().optional(),
    home: homeSettingSchema.optional(),
    nurseId: z.uuid().optional(),
    consultantId: z.uuid().optional(),
  })
  .refine((v) => (v.weightKg === undefined) === (v.weightDate === undefined), { error: 'Give the weight with the date it was taken', path: ['weightDate'] });
export type UpdateInfantInput = z.infer<typeof updateInfantSchema>;


export const INFANT_SORTS = ['name', '-name', 'correctedAge', '-correctedAge', 'elevation', '-elevation', 'status', '-status', 'enrolled', '-enrolled'] as const;
export const listInfantsQuerySchema = pageQuerySchema.extend({
  sort: z.enum(INFANT_SORTS, { error: 'Unknown sort' }).default('name'),
  status: z.enum(INFANT_STATUSES, { error: 'Unknown status' }).optional(),
  q: plainText().trim().max(100).optional(),
  scope: z.enum(['mine', 'programme']).optional(),
  flag: z.enum(INFANT_FLAGS).optional(),
  // Paging by position: the opaque cursor of the page's last row (next) or first row (prev), from the previous answer.
  cursor: plainText().trim().max(400).optional(),
  direction: z.enum(['next', 'prev'], { error: 'Direction is next or prev' }).default('next'),
});
export type ListInfantsQuery = z.infer<typeof listInfantsQuerySchema>;

const personRef = z.object({ id: z.uuid(), name: z.string() }).nullable();
export const activeSettingSchema = z.object({
  prescriptionId: z.uuid(),
  version: z.number(),
  flowLpm: z.number(),
  source: z.string(),
  sourceO2Percent: z.number(),
  effectiveFio2: z.number().nullable(),
  periods: z.object({ awake: z.number(), asleep: z.number(), feeding: z.number() }).nullable(),
  approvedAt: z.string().nullable(),
});

export const infantSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  correctedAge: z.string(),
  homeElevationM: z.number().nullable(),
  homePressureMmHg: z.number(),
  activeFlowLpm: z.number().nullable(),
  status: z.enum(INFANT_STATUSES),
  nurse: personRef,
  consultant: personRef,
  flags: z.array(z.enum(INFANT_FLAGS)),
});
export type InfantSummary = z.infer<typeof infantSummarySchema>;
export const infantsPageSchema = pagedSchema(infantSummarySchema).extend({
  /** Above 10,000 matching babies the total is PostgreSQL's estimate ("about N"). */
  totalIsEstimate: z.boolean().optional(),
  /** Cursors for the pages after and before this one; null at either end. */
  nextCursor: z.string().nullable().optional(),
  prevCursor: z.string().nullable().optional(),
});

export const contactSchemaOut = z.object({
  id: z.uuid(), name: z.string(), relation: z.string(), mobile: z.string().nullable(), email: z.string().nullable(),
  preferredChannel: z.enum(['sms', 'email']), consentSms: z.boolean(), consentEmail: z.boolean(), language: z.string(), timeZone: z.string(),
});

export const infantDetailSchema = infantSummarySchema.extend({
  givenName: z.string(), familyName: z.string(), sex: z.string(), birthDate: z.string(),
  gestation: z.object({ weeks: z.number(), days: z.number() }),
  postmenstrualAge: z.string(), chronologicalAge: z.string(),
  birthWeightG: z.number(), weightKg: z.number(), weightDate: z.string(), diagnoses: z.array(z.enum(DIAGNOSES)),
  site: z.object({ id: z.uuid(), name: z.string(), elevationM: z.number() }),
  hospital: z.object({ flowLpm: z.number(), source: z.string(), o2Percent: z.number() }),
  home: z.object({ address: z.string(), location: z.record(z.string(), z.number()), source: z.string(), o2Percent: z.number() }),
  activeSetting: activeSettingSchema.nullable(),
  contacts: z.array(contactSchemaOut),
  rowVersion: z.number(),
  enrolledAt: z.string(),
});
export type InfantDetail = z.infer<typeof infantDetailSchema>;

export const auditEventSchema = z.object({
  id: z.string(),
  at: z.string(),
  action: z.string(),
  actor: z.object({ id: z.uuid(), name: z.string() }).nullable(),
  details: z.record(z.string(), z.unknown()),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;
/** `people`: names for the staff ids the details point at (a visit's nurse, a new consultant), so each line reads in words. */
export const auditEventsSchema = z.object({ items: z.array(auditEventSchema), people: z.record(z.string(), z.string()).default({}) });
