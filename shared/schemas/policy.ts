import { z } from 'zod';
import { DEFAULT_CANNULA_MAX_FLOW_LPM, DEFAULT_FLOWMETER_STEPS_LPM } from '../clinical/flowmeter';
import { DEFAULT_DRIFT_THRESHOLD_FIO2 } from '../clinical/growth';

const int = (min: number, max: number, what: string) =>
  z.number({ error: `Enter ${what}` }).int({ error: 'Use a whole number' }).min(min, { error: `At least ${min}` }).max(max, { error: `At most ${max}` });

export const spo2TargetsSchema = z.strictObject({
  /** Overnight mean SpO2 at or above this meets target (TSANZ 2020; BTS 2009 as cited by Starship: ≥ 93 %). */
  overnightMeanMin: z.number().min(85).max(100),
  /** Share of valid overnight time below 90 % must stay under this (same sources: < 5 %). */
  pctBelow90Max: z.number().min(0).max(50),
  /** Higher mean target with pulmonary hypertension (Starship guideline: ≥ 95 %). */
  pulmonaryHypertensionMeanMin: z.number().min(85).max(100),
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
  minDaysBetweenStepDowns: int(1, 90, 'days'),
  /** Days off oxygen, with a satisfactory room-air study at the end, before leaving the programme. */
  offOxygenObservationDays: int(1, 180, 'days'),
});

/** A programme's clinical settings; every change is a new numbered version. */
export const policySettingsSchema = z.strictObject({
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
  readingEditWindowMinutes: int(0, 24 * 60, 'minutes'),
});
export type PolicySettings = z.infer<typeof policySettingsSchema>;

export const DEFAULT_POLICY_SETTINGS: PolicySettings = {
  flowmeterStepsLpm: [...DEFAULT_FLOWMETER_STEPS_LPM],
  cannulaMaxFlowLpm: DEFAULT_CANNULA_MAX_FLOW_LPM,
  driftThresholdFio2: DEFAULT_DRIFT_THRESHOLD_FIO2,
  pressureModel: 'isa-1976',
  // TSANZ 2020 / BTS 2009 targets (clinical-methods.md §4.2–4.3); PH target from the Starship guideline (§4.2).
  spo2Targets: { overnightMeanMin: 93, pctBelow90Max: 5, pulmonaryHypertensionMeanMin: 95 },
  // Common practice: first home check within 72 h of discharge, weekly for four weeks, then four-weekly.
  schedule: { firstCheckWithinHours: 72, weeklyChecks: 4, thenEveryWeeks: 4, planAheadWeeks: 12, overnightStudyBeforeStepDown: true, followUpDaysAfterStepDown: 7 },
  // Common practice: one flowmeter step at a time, night-only below 0.1 L/min, then off; 4 weeks off before leaving.
  stepDown: { stepsPerDecrease: 1, sleepOnlyBelowLpm: 0.1, minDaysBetweenStepDowns: 14, offOxygenObservationDays: 28 },
  readingEditWindowMinutes: 30,
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
});
export type UpdatePolicyInput = z.infer<typeof updatePolicySchema>;

export const policyHistorySchema = z.object({
  items: z.array(z.object({ version: z.number().int(), createdAt: z.string(), createdBy: z.object({ id: z.uuid(), name: z.string() }).nullable() })),
});
export type PolicyHistory = z.infer<typeof policyHistorySchema>;
