import { z } from 'zod';
import { plainText } from './common';
import { AIRCRAFT_CABIN_MAX_ALTITUDE_FT } from '../clinical/journey';
import { conversionPreviewResponseSchema } from './conversions';

export const JOURNEY_MODES = ['road', 'flight'] as const;
export type JourneyMode = (typeof JOURNEY_MODES)[number];
export const JOURNEY_MODE_LABELS: Record<JourneyMode, string> = { road: 'By road', flight: 'By air' };

export const JOURNEY_STATUSES = ['waiting', 'approved', 'declined'] as const;
export type JourneyStatus = (typeof JOURNEY_STATUSES)[number];
export const JOURNEY_STATUS_LABELS: Record<JourneyStatus, string> = {
  waiting: 'Waiting for the consultant',
  approved: 'Approved',
  declined: 'Not approved',
};

export const JOURNEY_PERIODS = ['awake', 'asleep', 'feeding'] as const;
export type JourneyPeriod = (typeof JOURNEY_PERIODS)[number];

/** 60 days: longer stays away are a change of home, not a journey. */
export const JOURNEY_MAX_HOURS_AWAY = 24 * 60;

const date = z.iso.date({ error: 'Use a date like 2026-12-03' });
// Same inhabited-land range as the conversion preview (Dead Sea shore to high Andean towns).
const elevationM = z.number({ error: 'Enter the elevation in metres' })
  .min(-500, { error: 'At least -500 m' }).max(6000, { error: 'At most 6000 m' });

const daysBetween = (from: string, to: string) => Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);

/**
 * What a family member or coordinator asks for. A road journey needs the destination's elevation; a flight is
 * planned for the cabin (8,000 ft unless a lower cabin altitude is given) or a higher destination, whichever is
 * higher. Whether the dates have passed depends on the family's today: see journeyDateErrors.
 */
export const createJourneySchema = z
  .strictObject({
    mode: z.enum(JOURNEY_MODES, { error: 'Choose by road or by air' }),
    destinationName: plainText({ error: 'Name the destination' }).trim()
      .min(2, { error: 'Name the destination' }).max(120, { error: 'At most 120 characters' }),
    destinationElevationM: elevationM.nullish(),
    cabinAltitudeFt: z.number({ error: 'Enter the cabin altitude in feet' })
      .min(0, { error: 'At least 0 ft' })
      .max(AIRCRAFT_CABIN_MAX_ALTITUDE_FT, { error: 'At most 8,000 ft, the highest cabin altitude allowed' })
      .nullish(),
    departOn: date,
    returnOn: date,
    hoursAway: z.number({ error: 'Enter the hours away from the home oxygen supply' })
      .positive({ error: 'More than 0 hours' })
      .max(JOURNEY_MAX_HOURS_AWAY, { error: `At most ${JOURNEY_MAX_HOURS_AWAY} hours (60 days)` }),
    notes: plainText({ multiline: true }).trim().max(1000, { error: 'At most 1000 characters' }).nullish(),
  })
  .superRefine((j, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    if (j.mode === 'road' && (j.destinationElevationM === undefined || j.destinationElevationM === null)) {
      issue('destinationElevationM', 'Enter the elevation of the destination in metres');
    }
    if (j.mode === 'road' && j.cabinAltitudeFt !== undefined && j.cabinAltitudeFt !== null) {
      issue('cabinAltitudeFt', 'Only for a flight');
    }
    if (typeof j.departOn !== 'string' || typeof j.returnOn !== 'string') return;
    const days = daysBetween(j.departOn, j.returnOn);
    if (days < 0) issue('returnOn', 'The return must be on or after the departure');
    else if (typeof j.hoursAway === 'number' && j.hoursAway > (days + 1) * 24) {
      issue('hoursAway', `More hours than the ${days + 1} day(s) from departure to return`);
    }
  });
export type CreateJourneyInput = z.infer<typeof createJourneySchema>;
export type CreateJourneyFormValues = z.input<typeof createJourneySchema>;

/** Dates already gone in the family's own calendar; `today` is YYYY-MM-DD in their time zone. */
export function journeyDateErrors(input: { departOn: string; returnOn: string }, today: string): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  if (input.departOn < today) errors.departOn = ['That date has passed'];
  if (input.returnOn < today) errors.returnOn = ['That date has passed'];
  return errors;
}

/** The form schema with the date check built in, for the browser (the server runs both parts itself). */
export const createJourneySchemaOn = (today: string) =>
  createJourneySchema.superRefine((j, ctx) => {
    if (typeof j.departOn !== 'string' || typeof j.returnOn !== 'string') return;
    for (const [path, messages] of Object.entries(journeyDateErrors(j, today))) {
      for (const message of messages) ctx.addIssue({ code: 'custom', path: [path], message });
    }
  });

export const journeyDecisionSchema = z
  .strictObject({
    decision: z.enum(['approve', 'decline'], { error: 'Choose approve or decline' }),
    reason: plainText({ multiline: true }).trim().max(1000, { error: 'At most 1000 characters' }).optional(),
    rowVersion: z.number({ error: 'Missing the version you saw' }).int().positive(),
  })
  .superRefine((d, ctx) => {
    if (d.decision === 'decline' && !(d.reason && d.reason.length >= 2)) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: 'Say why the journey plan is not approved' });
    }
  });
export type JourneyDecisionInput = z.infer<typeof journeyDecisionSchema>;

/** The family's cylinder-time form: which of the programme's cylinders, and what its gauge reads. */
export const cylinderCheckSchema = z.strictObject({
  cylinderId: plainText({ error: 'Choose a cylinder' }).min(1, { error: 'Choose a cylinder' }),
  gauge: z.number({ error: 'Enter the gauge reading' }).min(0, { error: 'At least 0' }).max(5000, { error: 'At most 5000' }),
});
export type CylinderCheckInput = z.infer<typeof cylinderCheckSchema>;

/** Like a conversion's working line, with the units a supply calculation needs (ft, h, min, L/bar, cylinders…). */
const journeyWorkingLineSchema = z.object({
  key: z.string(),
  label: z.string(),
  value: z.number().nullable(),
  unit: z.string(),
  formula: z.string(),
  source: z.string(),
});
export type JourneyWorkingLine = z.infer<typeof journeyWorkingLineSchema>;
const person = z.object({ id: z.uuid(), name: z.string() });

export const journeyPeriodPlanSchema = z.object({
  period: z.enum(JOURNEY_PERIODS),
  /** The approved setting at home for this part of the day (0 = off). */
  homeFlowLpm: z.number(),
  /** The exact flow that keeps the inspired PO2 of home there; null when no cannula flow reaches it. */
  requiredFlowLpm: z.number().nullable(),
  /** The setting there: rounded up to a flowmeter step and never below the home setting; null when not deliverable. */
  flowLpm: z.number().nullable(),
  /** The cannula cannot give what is needed there (beyond its limit or above the supply purity). */
  exceedsCannula: z.boolean(),
  /** Less would do there, but a journey check does not lower the setting: the treating team decides that. */
  keptHomeFlow: z.boolean(),
});
export type JourneyPeriodPlan = z.infer<typeof journeyPeriodPlanSchema>;

export const journeyCylinderPlanSchema = z.object({
  cylinderId: z.string(),
  name: z.string(),
  /** Full cylinder down to its change-over pressure, at the supply flow; null when no flow can be planned. */
  minutesPerCylinder: z.number().nullable(),
  /** Whole cylinders for the hours away plus the reserve; null when no flow can be planned. */
  count: z.number().int().nullable(),
});
export type JourneyCylinderPlan = z.infer<typeof journeyCylinderPlanSchema>;

export const journeyWorkingSchema = z.object({
  /** Journey-level steps: destination altitude and pressure, supply flow, minutes and counts per cylinder. */
  lines: z.array(journeyWorkingLineSchema),
  /** One conversion per distinct home flow. Inside it, "hospital" is the baby's home and "home" is the destination. */
  conversions: z.array(z.object({ periods: z.array(z.enum(JOURNEY_PERIODS)), homeFlowLpm: z.number(), conversion: conversionPreviewResponseSchema })),
  note: z.string(),
});

export const journeyPlanSchema = z.object({
  origin: z.object({ elevationM: z.number().nullable(), pressureMmHg: z.number() }),
  destination: z.object({ kind: z.enum(['place', 'aircraft-cabin']), elevationM: z.number(), pressureMmHg: z.number() }),
  pressureModel: z.object({ name: z.string(), version: z.string() }),
  periods: z.array(journeyPeriodPlanSchema),
  /** The flow the cylinders are counted at: the highest setting of the day there, so supply never runs short. */
  supplyFlowLpm: z.number().nullable(),
  exceedsCannula: z.boolean(),
  hoursAway: z.number(),
  reservePercent: z.number(),
  cylinders: z.array(journeyCylinderPlanSchema),
  cautions: z.array(z.string()),
  /** Staff only (omitted for families). */
  warnings: z.array(z.object({ code: z.string(), message: z.string() })).optional(),
  /** Staff only (omitted for families). */
  working: journeyWorkingSchema.optional(),
});
export type JourneyPlan = z.infer<typeof journeyPlanSchema>;

export const journeyRequestSchema = z.object({
  mode: z.enum(JOURNEY_MODES),
  destinationName: z.string(),
  destinationElevationM: z.number().nullable(),
  /** For a flight, the cabin altitude planned for (8000 when none was given); null by road. */
  cabinAltitudeFt: z.number().nullable(),
  departOn: z.string(),
  returnOn: z.string(),
  hoursAway: z.number(),
  notes: z.string().nullable(),
});

export const journeySchema = z.object({
  id: z.uuid(),
  infantId: z.uuid(),
  infantName: z.string(),
  status: z.enum(JOURNEY_STATUSES),
  rowVersion: z.number().int(),
  request: journeyRequestSchema,
  /** Staff: always. Family: only once approved (null while waiting or when not approved). */
  plan: journeyPlanSchema.nullable(),
  requestedBy: person,
  createdAt: z.string(),
  decision: z.object({
    outcome: z.enum(['approved', 'declined']),
    by: person,
    at: z.string(),
    /** Staff only; null for families. */
    reason: z.string().nullable(),
  }).nullable(),
});
export type Journey = z.infer<typeof journeySchema>;
export const journeyResponseSchema = z.object({ journey: journeySchema });
export const journeyListSchema = z.object({ items: z.array(journeySchema) });
