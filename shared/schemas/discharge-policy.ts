import { z } from 'zod';
import { plainText } from './common';

/** The checklist's groups, in the order the record and the letter show them. */
export const DISCHARGE_GROUPS = ['family_training', 'home_safety', 'equipment', 'follow_up', 'letters'] as const;
export type DischargeGroup = (typeof DISCHARGE_GROUPS)[number];
export const DISCHARGE_GROUP_LABELS: Record<DischargeGroup, string> = {
  family_training: 'Family training', home_safety: 'Home safety', equipment: 'Equipment', follow_up: 'Follow-up', letters: 'Letters',
};
/** Only these groups concern the family: they never see equipment orders, follow-up work or letters. */
export const FAMILY_GROUPS: readonly DischargeGroup[] = ['family_training', 'home_safety'];

/** What a ticked item must carry as evidence: the day it was done and who did it. */
export const DISCHARGE_EVIDENCE = ['date', 'person'] as const;
export type DischargeEvidenceKind = (typeof DISCHARGE_EVIDENCE)[number];

/** The missing-list key for "the home setting is approved by a consultant"; no checklist item may use it. */
export const SETTING_APPROVED_KEY = 'setting_approved';

export const dischargeItemRuleSchema = z.strictObject({
  key: plainText().regex(/^[a-z][a-z0-9_]{1,39}$/, { error: 'Lower-case letters, digits and underscores, starting with a letter' })
    .refine((k) => k !== SETTING_APPROVED_KEY, { error: 'This code is kept for the approved setting' }),
  label: plainText().trim().min(2, { error: 'Name the item' }).max(120, { error: 'At most 120 characters' }),
  group: z.enum(DISCHARGE_GROUPS, { error: 'Choose a group' }),
  evidence: z.array(z.enum(DISCHARGE_EVIDENCE)).max(2).refine((e) => new Set(e).size === e.length, { error: 'Each kind of evidence once' }),
  familySees: z.boolean(),
  /** The item in plain words for the family page. */
  familyLabel: plainText().trim().max(160, { error: 'At most 160 characters' }),
  /** Where the item comes from: a publication, or "common practice". */
  source: plainText().trim().max(200, { error: 'At most 200 characters' }),
}).superRefine((item, ctx) => {
  if (!item.familySees) return;
  if (!FAMILY_GROUPS.includes(item.group)) ctx.addIssue({ code: 'custom', path: ['familySees'], message: 'Families see only family training and home safety items' });
  if (item.familyLabel.length < 2) ctx.addIssue({ code: 'custom', path: ['familyLabel'], message: 'Say it in plain words for the family' });
});
export type DischargeItemRule = z.infer<typeof dischargeItemRuleSchema>;

export const dischargeRulesSchema = z.strictObject({
  items: z.array(dischargeItemRuleSchema).max(40, { error: 'At most 40 items' })
    .refine((list) => new Set(list.map((i) => i.key)).size === list.length, { error: 'Each item needs its own code' }),
  /** The nurse's first home visit is proposed this many days after the discharge date. */
  firstVisitDaysAfterDischarge: z.number({ error: 'Enter a number of days' }).int({ error: 'Use a whole number' })
    .min(0, { error: 'At least 0' }).max(28, { error: 'At most 28' }),
});
export type DischargeRules = z.infer<typeof dischargeRulesSchema>;

const BTS = 'BTS guideline for home oxygen in children (Balfour-Lynn et al., Thorax 2009)';
const ATS = 'ATS guideline: home oxygen therapy for children (Hayes et al., Am J Respir Crit Care Med 2019)';
const COMMON = 'common practice';
const item = (key: string, group: DischargeItemRule['group'], label: string, source: string, familyLabel = '', evidence: DischargeItemRule['evidence'] = []): DischargeItemRule =>
  ({ key, label, group, evidence, familySees: familyLabel !== '', familyLabel, source });

/**
 * The default checklist. Each item names its source beside it (docs/discharge-sources.md lists them); the
 * attributions are to the publication as a whole, recalled, not quoted: check them against the text locally.
 */
export const DEFAULT_DISCHARGE_RULES: DischargeRules = {
  items: [
    item('equipment_use', 'family_training', 'Family trained to use the oxygen equipment', `${BTS}; ${ATS}`, 'You have been shown how to use the oxygen equipment', ['date', 'person']),
    item('cylinder_change', 'family_training', 'Family can change a cylinder and read its gauge', BTS, 'You can change a cylinder and read how full it is', ['date', 'person']),
    item('flow_setting', 'family_training', 'Family can set and check the flow on the flowmeter', BTS, 'You can set the flow and check it'),
    item('recognise_trouble', 'family_training', 'Family know the signs of a baby in trouble and whom to call', `${BTS}; ${ATS}`, 'You know the warning signs and who to call'),
    item('basic_life_support', 'family_training', 'Family taught basic life support for infants', COMMON, 'You have learned baby resuscitation (basic life support)', ['date', 'person']),
    item('home_assessment', 'home_safety', 'Home assessed for oxygen safety', BTS, 'Someone from the team has checked your home', ['date', 'person']),
    item('no_smoking', 'home_safety', 'No smoking or vaping in the home agreed', `${BTS}; ${ATS}`, 'Nobody smokes or vapes in your home'),
    item('smoke_alarms', 'home_safety', 'Working smoke alarms in the home', COMMON, 'Your smoke alarms work'),
    item('cylinder_storage', 'home_safety', 'Place for the cylinders agreed (ventilated, away from heat)', COMMON, 'You know where the cylinders will stand'),
    item('concentrator_power', 'home_safety', 'Power for a concentrator and the electricity company told', COMMON, 'Your electricity company knows about the oxygen'),
    item('equipment_ordered', 'equipment', 'Equipment ordered from the supplier', COMMON),
    item('equipment_installed', 'equipment', 'Equipment installed before the discharge date', COMMON, '', ['date']),
    item('community_nurse_named', 'follow_up', 'Community nurse named for the home visits', BTS),
    item('clinic_follow_up', 'follow_up', 'Clinic follow-up arranged', `${BTS}; ${ATS}`),
    item('family_doctor_told', 'letters', 'Discharge letter sent to the family doctor', BTS),
    item('community_team_told', 'letters', 'Discharge letter sent to the community team', BTS),
  ],
  // Common practice: the first visit the day after discharge, inside the 72-hour first check (policy schedule).
  firstVisitDaysAfterDischarge: 1,
};
