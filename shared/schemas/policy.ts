import { z } from 'zod';
import { plainText } from './common';
import { countryCodeSchema } from './phone';
import { DEFAULT_COUNTRY, readPhone } from '../phone/phone';
import { DEFAULT_CANNULA_MAX_FLOW_LPM, DEFAULT_FLOWMETER_STEPS_LPM } from '../clinical/flowmeter';
import { DEFAULT_DRIFT_THRESHOLD_FIO2 } from '../clinical/growth';
import { DEFAULT_DISCHARGE_RULES, dischargeRulesSchema } from './discharge-policy';
import { DEFAULT_SUPPLIER_SETTINGS, supplierSettingsSchema } from './supplier';

const int = (min: number, max: number, what: string) =>
  z.number({ error: `Enter ${what}` }).int({ error: 'Use a whole number' }).min(min, { error: `At least ${min}` }).max(max, { error: `At most ${max}` });

export const spo2TargetsSchema = z.strictObject({
  /** Overnight mean SpO2 at or above this meets target (TSANZ 2020; BTS 2009 as cited by Starship: ≥ 93 %). */
  overnightMeanMin: z.number().min(85).max(100),
  /** Share of valid overnight time below 90 % must stay under this (same sources: < 5 %). */
  pctBelow90Max: z.number().min(0).max(50),
  /** Higher mean target with pulmonary hypertension (Starship guideline: ≥ 95 %). */
  pulmonaryHypertensionMeanMin: z.number().min(85).max(100),
  /** Recent spot readings: their mean at or above this (NHS GGC neonatal home-oxygen guideline: mean ≥ 93 %). */
  spotMeanMin: z.number().min(85).max(100),
  /** A spot reading at or below this is out of range (ATS 2019: spot readings ≤ 90 % define hypoxaemia under 1 year). */
  spotLowMax: z.number().min(70).max(99),
});

/** How an overnight recording is analysed and when it can be judged at all. */
export const oximetryRulesSchema = z.strictObject({
  /** A fall must last this long to count (10 s adult convention, from memory; CHIME counted falls of ≥ 5 s). */
  minEventSeconds: int(2, 60, 'seconds'),
  /** Below this much valid time a study is too short to judge (Urschitz 2003 excluded recordings under 5 h). */
  minValidMinutes: int(60, 24 * 60, 'minutes'),
});

export const scheduleRulesSchema = z.strictObject({
  firstCheckWithinHours: int(1, 336, 'hours'),
  weeklyChecks: int(0, 26, 'a number of weeks'),
  thenEveryWeeks: int(1, 26, 'a number of weeks'),
  /** Horizon of planned routine checks; later ones are planned as time moves on. */
  planAheadWeeks: int(4, 52, 'a number of weeks'),
  overnightStudyBeforeStepDown: z.boolean(),
  followUpDaysAfterStepDown: int(1, 60, 'days'),
});

export const stepDownRulesSchema = z.strictObject({
  /** How many flowmeter steps one step down lowers the flow. */
  stepsPerDecrease: int(1, 10, 'steps'),
  /** Below this flow the next step is night-time (asleep) only rather than a lower flow. */
  sleepOnlyBelowLpm: z.number().min(0).max(2),
  /** Minimum days on the current setting before the next step down. */
  minDaysBetweenStepDowns: int(1, 90, 'days'),
  /** The overnight study that supports a step down must be at most this old. */
  studyWithinDays: int(1, 60, 'days'),
  /** Spot readings from this many days back are checked. */
  readingsWithinDays: int(1, 60, 'days'),
  /** Days off oxygen, with a satisfactory room-air study at the end, before leaving the programme. */
  offOxygenObservationDays: int(1, 180, 'days'),
});

const clock = plainText().regex(/^([01]\d|2[0-3]):[0-5]\d$/, { error: 'Use a time like 08:00' });

/** When messages go out; every time is the recipient's own local time. */
export const reminderRulesSchema = z.strictObject({
  /** Families: the day before a visit, at this time. */
  dayBeforeAt: clock,
  /** Families: on the morning of a visit, at this time (moved to the end of quiet hours if it falls inside them). */
  morningOfAt: clock,
  /** No message starts inside [quietStart, quietEnd); one that would is held until quietEnd. */
  quietStart: clock,
  quietEnd: clock,
  /** Nurses' and consultants' morning digests. */
  staffDigestAt: clock,
  /** A proposal waiting longer than this goes into the consultants' digest. */
  signOffWaitingHours: int(1, 24 * 14, 'hours'),
  // --- Failure alerts (issue 12): failed family messages are gathered into one e-mail per coordinator per period.
  failureAlertPeriodMinutes: int(5, 24 * 60, 'minutes'),
});

// The characters here, so the message shows beside the row even when another part of the form is wrong; whether it
// is a number of the programme's country is checked in updatePolicySchema (landlines allowed: families call these).
const phoneNumber = plainText().trim().max(40, { error: 'At most 40 characters' })
  .regex(/^[+0-9 ().-]*[0-9][+0-9 ().-]*$/, { error: 'Use digits, spaces and an optional leading +' });

/** Who a family calls, shown on the family page and the printed care plan. */
export const programmeContactsSchema = z.strictObject({
  phones: z
    .array(z.strictObject({
      label: plainText().trim().min(2, { error: 'Name this number' }).max(80),
      number: phoneNumber,
      when: plainText().trim().max(160, { error: 'At most 160 characters' }),
    }))
    .max(8, { error: 'At most 8 numbers' }),
  /** The local emergency number (999, 112, 911 …). */
  emergencyNumber: plainText().trim().regex(/^[0-9]{2,6}$/, { error: 'Use the short emergency number, digits only' }),
});

/**
 * A cylinder the programme's supplier delivers: its labelled contents when full and the pressure it is full at.
 * Contents left ≈ contents × (gauge − residual) ÷ full pressure (the factor method, docs/clinical-sources.md §7).
 */
export const cylinderTypeSchema = z.strictObject({
  id: plainText().regex(/^[a-z0-9-]{1,40}$/, { error: 'Lower-case letters, digits and dashes' }),
  name: plainText().trim().min(2, { error: 'Name the cylinder' }).max(80),
  contentLitres: z.number({ error: 'Enter the contents in litres' }).positive().max(20000),
  unit: z.enum(['bar', 'psi']),
  fullPressure: z.number({ error: 'Enter the full pressure' }).positive().max(5000),
  residualPressure: z.number({ error: 'Enter the pressure to change it at' }).min(0).max(5000),
}).refine((c) => c.residualPressure < c.fullPressure, { path: ['residualPressure'], error: 'Must be below the full pressure' });
export type CylinderType = z.infer<typeof cylinderTypeSchema>;

export const equipmentSupplySchema = z.strictObject({
  cylinders: z.array(cylinderTypeSchema).max(20)
    .refine((list) => new Set(list.map((c) => c.id)).size === list.length, { error: 'Each cylinder needs its own id' }),
  /** Extra supply on top of the computed need, as a percentage (a programme decision). */
  reservePercent: int(0, 200, 'a percentage'),
});

/** A programme's clinical settings; every change is a new numbered version. */
export const policySettingsSchema = z.strictObject({
  /** ISO 3166 code: family and programme numbers typed without a country code are read, and shown, as its numbers. */
  country: countryCodeSchema,
  flowmeterStepsLpm: z
    .array(z.number().positive({ error: 'Flowmeter steps must be above 0 L/min' }).max(15))
    .min(1, { error: 'Give at least one flowmeter step' })
    .max(200)
    .refine((s) => s.every((v, i) => i === 0 || v > s[i - 1]), { error: 'Flowmeter steps must be in ascending order without repeats' }),
  cannulaMaxFlowLpm: z.number().positive().max(15),
  driftThresholdFio2: z.number().min(0.001).max(0.2),
  pressureModel: z.enum(['isa-1976', 'west-1996']),
  spo2Targets: spo2TargetsSchema,
  schedule: scheduleRulesSchema,
  stepDown: stepDownRulesSchema,
  oximetry: oximetryRulesSchema,
  readingEditWindowMinutes: int(0, 24 * 60, 'minutes'),
  reminders: reminderRulesSchema,
  contacts: programmeContactsSchema,
  supply: equipmentSupplySchema,
  /** The discharge checklist's items and the first home visit's interval (shared/schemas/discharge-policy.ts). */
  discharge: dischargeRulesSchema,
  // Equipment orders (issue 16): who delivers the equipment and what the programme lends.
  supplier: supplierSettingsSchema,
});
export type PolicySettings = z.infer<typeof policySettingsSchema>;

export const DEFAULT_POLICY_SETTINGS: PolicySettings = {
  // The demo programmes are in the United Kingdom.
  country: DEFAULT_COUNTRY,
  flowmeterStepsLpm: [...DEFAULT_FLOWMETER_STEPS_LPM],
  cannulaMaxFlowLpm: DEFAULT_CANNULA_MAX_FLOW_LPM,
  driftThresholdFio2: DEFAULT_DRIFT_THRESHOLD_FIO2,
  pressureModel: 'isa-1976',
  // TSANZ 2020 / BTS 2009 targets (docs/clinical-sources.md §4.2–4.3); PH target from the Starship guideline (§4.2).
  // Spot readings: NHS GGC (mean ≥ 93 %) and ATS 2019 (≤ 90 % is low under 1 year), docs/clinical-sources.md §4.1, §4.3.
  spo2Targets: { overnightMeanMin: 93, pctBelow90Max: 5, pulmonaryHypertensionMeanMin: 95, spotMeanMin: 93, spotLowMax: 90 },
  // Common practice: first home check within 72 h of discharge, weekly for four weeks, then four-weekly.
  schedule: { firstCheckWithinHours: 72, weeklyChecks: 4, thenEveryWeeks: 4, planAheadWeeks: 12, overnightStudyBeforeStepDown: true, followUpDaysAfterStepDown: 7 },
  // Common practice: one flowmeter step at a time, night-only below 0.1 L/min, then off; 4 weeks off before leaving.
  // Study and readings windows: a week, as NHS GGC asks for a stable need over the preceding week (§4.3).
  stepDown: { stepsPerDecrease: 1, sleepOnlyBelowLpm: 0.1, minDaysBetweenStepDowns: 14, studyWithinDays: 7, readingsWithinDays: 7, offOxygenObservationDays: 28 },
  oximetry: { minEventSeconds: 10, minValidMinutes: 300 },
  readingEditWindowMinutes: 30,
  // Quiet hours 21:00–08:00 as the product asks; the other times and the 24 h wait are common practice defaults.
  reminders: { dayBeforeAt: '17:00', morningOfAt: '08:00', quietStart: '21:00', quietEnd: '08:00', staffDigestAt: '08:00', signOffWaitingHours: 24,
    // Common practice: coordinators hear of failed family messages within the hour, in one e-mail.
    failureAlertPeriodMinutes: 60 },
  // Placeholders until an admin enters the programme's own numbers.
  contacts: { phones: [], emergencyNumber: '999' },
  // Demo defaults only (a supplier's labelled sizes vary, docs/clinical-sources.md §7); reserve: common practice.
  supply: {
    cylinders: [
      { id: 'small-portable', name: 'Small portable (460 L at 230 bar)', contentLitres: 460, unit: 'bar', fullPressure: 230, residualPressure: 20 },
      { id: 'large-home', name: 'Large home cylinder (1360 L at 137 bar)', contentLitres: 1360, unit: 'bar', fullPressure: 137, residualPressure: 14 },
    ],
    reservePercent: 50,
  },
  // Sources beside each item in shared/schemas/discharge-policy.ts and docs/discharge-sources.md.
  discharge: DEFAULT_DISCHARGE_RULES,
  // Empty until the programme enters its supplier (shared/schemas/supplier.ts).
  supplier: DEFAULT_SUPPLIER_SETTINGS,
};

/** Older stored versions lack newer sections; fill them from the defaults section by section. */
export function withPolicyDefaults(stored: Partial<PolicySettings>): PolicySettings {
  const d = DEFAULT_POLICY_SETTINGS;
  return {
    ...d,
    ...stored,
    spo2Targets: { ...d.spo2Targets, ...stored.spo2Targets },
    schedule: { ...d.schedule, ...stored.schedule },
    stepDown: { ...d.stepDown, ...stored.stepDown },
    oximetry: { ...d.oximetry, ...stored.oximetry },
    reminders: { ...d.reminders, ...stored.reminders },
    contacts: { ...d.contacts, ...stored.contacts },
    supply: { ...d.supply, ...stored.supply },
    discharge: { ...d.discharge, ...stored.discharge },
    supplier: { ...d.supplier, ...stored.supplier },
  };
}

export const policySchema = z.object({
  programmeId: z.uuid(),
  version: z.number().int(),
  settings: policySettingsSchema,
  createdAt: z.string().nullable(),
  createdBy: z.object({ id: z.uuid(), name: z.string() }).nullable().optional(),
});
export type Policy = z.infer<typeof policySchema>;

export const updatePolicySchema = z.strictObject({
  /** The version the admin edited; a stale one is refused so two admins cannot overwrite each other silently. */
  baseVersion: z.number().int().min(0),
  settings: policySettingsSchema,
}).superRefine((v, ctx) => {
  v.settings.contacts.phones.forEach((p, i) => {
    const r = readPhone(p.number, v.settings.country, 'any');
    if (!r.ok) ctx.addIssue({ code: 'custom', path: ['settings', 'contacts', 'phones', i, 'number'], message: r.message });
  });
  const supplierPhone = v.settings.supplier.phone;
  if (supplierPhone) {
    const r = readPhone(supplierPhone, v.settings.country, 'any');
    if (!r.ok) ctx.addIssue({ code: 'custom', path: ['settings', 'supplier', 'phone'], message: r.message });
  }
}).transform((v) => {
  // Stored in E.164 like every other number; shown in the country's own form.
  const phones = v.settings.contacts.phones.map((p) => {
    const r = readPhone(p.number, v.settings.country, 'any');
    return r.ok ? { ...p, number: r.e164 } : p;
  });
  const supplierPhone = v.settings.supplier.phone ? readPhone(v.settings.supplier.phone, v.settings.country, 'any') : null;
  const supplier = supplierPhone?.ok ? { ...v.settings.supplier, phone: supplierPhone.e164 } : v.settings.supplier;
  return { ...v, settings: { ...v.settings, contacts: { ...v.settings.contacts, phones }, supplier } };
});
export type UpdatePolicyInput = z.infer<typeof updatePolicySchema>;

export const policyHistorySchema = z.object({
  items: z.array(z.object({ version: z.number().int(), createdAt: z.string(), createdBy: z.object({ id: z.uuid(), name: z.string() }).nullable() })),
});
export type PolicyHistory = z.infer<typeof policyHistorySchema>;
