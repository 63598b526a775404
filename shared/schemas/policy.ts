import { z } from 'zod';
import { DEFAULT_CANNULA_MAX_FLOW_LPM, DEFAULT_FLOWMETER_STEPS_LPM } from '../clinical/flowmeter';
import { DEFAULT_DRIFT_THRESHOLD_FIO2 } from '../clinical/growth';

/** A programme's clinical settings; every change is a new numbered version. */
export const policySettingsSchema = z.strictObject({
  flowmeterStepsLpm: z
    .array(z.number().positive({ error: 'Flowmeter steps must be above 0 L/min' }))
    .min(1)
    .max(200)
    .refine((s) => s.every((v, i) => i === 0 || v > s[i - 1]), { error: 'Flowmeter steps must be in ascending order without repeats' }),
  cannulaMaxFlowLpm: z.number().positive().max(15),
  driftThresholdFio2: z.number().min(0.001).max(0.2),
  pressureModel: z.enum(['isa-1976', 'west-1996']),
});
export type PolicySettings = z.infer<typeof policySettingsSchema>;

export const DEFAULT_POLICY_SETTINGS: PolicySettings = {
  flowmeterStepsLpm: [...DEFAULT_FLOWMETER_STEPS_LPM],
  cannulaMaxFlowLpm: DEFAULT_CANNULA_MAX_FLOW_LPM,
  driftThresholdFio2: DEFAULT_DRIFT_THRESHOLD_FIO2,
  pressureModel: 'isa-1976',
};

export const policySchema = z.object({
  programmeId: z.uuid(),
  version: z.number().int(),
  settings: policySettingsSchema,
  createdAt: z.string().nullable(),
});
export type Policy = z.infer<typeof policySchema>;
