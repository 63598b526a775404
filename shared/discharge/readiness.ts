import { DISCHARGE_GROUPS, FAMILY_GROUPS, SETTING_APPROVED_KEY, type DischargeEvidenceKind, type DischargeItemRule } from '../schemas/discharge-policy';
import type { InfantStatus } from '../schemas/infants';

/** After a baby has left the programme its hospital discharge is history: the checklist and the date are closed. */
export const dischargeClosed = (status: InfantStatus): boolean => status === 'left_programme';

/** What is stored for one item of one baby. */
export interface ItemState { key: string; done: boolean; evidence: { date?: string; person?: string } | null }

/**
 * What still stands between a baby and a discharge date: the approved setting first, then every item of the
 * programme's current checklist not ticked, in checklist order. Items stored under keys the policy no longer
 * has do not count; an item added to the policy later counts as not done.
 */
export function missingForDischarge(rules: readonly DischargeItemRule[], states: readonly ItemState[], settingApproved: boolean): string[] {
  const done = new Set(states.filter((s) => s.done).map((s) => s.key));
  const missing = rules.filter((r) => !done.has(r.key)).map((r) => r.key);
  return settingApproved ? missing : [SETTING_APPROVED_KEY, ...missing];
}

/** The evidence a tick needs and is not given, as field errors keyed like the request body. */
export function missingEvidence(rule: DischargeItemRule, evidence: { date?: string; person?: string } | undefined): Record<string, string[]> {
  const words: Record<DischargeEvidenceKind, string> = { date: 'Enter the date it was done', person: 'Say who did it' };
  const errors: Record<string, string[]> = {};
  for (const kind of rule.evidence) if (!evidence?.[kind]) errors[`evidence.${kind}`] = [words[kind]];
  return errors;
}

/** The items a family sees: those marked for them, in the groups that concern them, in group order. */
export function familyItems(rules: readonly DischargeItemRule[]): DischargeItemRule[] {
  return sortByGroup(rules.filter((r) => r.familySees && FAMILY_GROUPS.includes(r.group)));
}

export function sortByGroup<T extends { group: DischargeItemRule['group'] }>(items: readonly T[]): T[] {
  return DISCHARGE_GROUPS.flatMap((g) => items.filter((i) => i.group === g));
}
