import { describe, expect, it } from 'vitest';
import { familyItems, missingEvidence, missingForDischarge } from '../../../shared/discharge/readiness';
import { DEFAULT_DISCHARGE_RULES, dischargeRulesSchema, type DischargeItemRule } from '../../../shared/schemas/discharge-policy';
import { DEFAULT_POLICY_SETTINGS, withPolicyDefaults } from '../../../shared/schemas/policy';

const rule = (key: string, over: Partial<DischargeItemRule> = {}): DischargeItemRule =>
  ({ key, label: key, group: 'home_safety', evidence: [], familySees: false, familyLabel: '', source: 'common practice', ...over });
const rules = [rule('a'), rule('b'), rule('c')];
const done = (key: string) => ({ key, done: true, evidence: null });

describe('missingForDischarge', () => {
  it('when the setting is approved and every item ticked, then nothing is missing', () => {
    expect(missingForDischarge(rules, ['a', 'b', 'c'].map(done), true)).toEqual([]);
  });
  it('when the setting is not approved, then setting_approved comes first, then the unticked items in checklist order', () => {
    expect(missingForDischarge(rules, [done('b')], false)).toEqual(['setting_approved', 'a', 'c']);
  });
  it('when an item was unticked or is no longer in the policy, then the first counts as missing and the second is ignored', () => {
    expect(missingForDischarge(rules, [done('a'), { key: 'b', done: false, evidence: null }, done('c'), done('old')], true)).toEqual(['b']);
  });
});

describe('missingEvidence', () => {
  it('when an item needs the date and who did it, then each one not given is named as a field', () => {
    const r = rule('home', { evidence: ['date', 'person'] });
    expect(missingEvidence(r, undefined)).toEqual({ 'evidence.date': ['Enter the date it was done'], 'evidence.person': ['Say who did it'] });
    expect(missingEvidence(r, { date: '2026-12-01' })).toEqual({ 'evidence.person': ['Say who did it'] });
    expect(missingEvidence(r, { date: '2026-12-01', person: 'Tamsin Reed' })).toEqual({});
    expect(missingEvidence(rule('x'), undefined)).toEqual({});
  });
});

describe('the checklist in policy', () => {
  it('when the family reads it, then only their training and home-safety items, in group order', () => {
    const list = [rule('f', { group: 'follow_up' }), rule('h', { familySees: true, familyLabel: 'Home' }), rule('t', { group: 'family_training', familySees: true, familyLabel: 'T' }), rule('n')];
    expect(familyItems(list).map((r) => r.key)).toEqual(['t', 'h']);
  });
  it('when the defaults are checked, then they pass the schema and every item names a publication or common practice', () => {
    expect(dischargeRulesSchema.parse(DEFAULT_DISCHARGE_RULES)).toEqual(DEFAULT_DISCHARGE_RULES);
    // Sources: BTS 2009 (Balfour-Lynn et al., Thorax) and ATS 2019 (Hayes et al., AJRCCM), docs/discharge-sources.md.
    for (const item of DEFAULT_DISCHARGE_RULES.items) expect(item.source).toMatch(/Thorax 2009|Am J Respir Crit Care Med 2019|^common practice$/);
    // Default first visit: 1 day after discharge (common practice).
    expect(DEFAULT_DISCHARGE_RULES.firstVisitDaysAfterDischarge).toBe(1);
  });
  it('when a stored version predates the discharge section, then it runs on the default checklist', () => {
    const { discharge: _drop, ...older } = DEFAULT_POLICY_SETTINGS;
    expect(withPolicyDefaults(older).discharge).toEqual(DEFAULT_DISCHARGE_RULES);
  });
  it('when a programme breaks the rules, then the schema says why: a reserved or repeated code, a family item outside their groups', () => {
    const bad = dischargeRulesSchema.safeParse({ items: [rule('setting_approved'), rule('dup'), rule('dup'), rule('f', { group: 'letters', familySees: true, familyLabel: 'x y' })], firstVisitDaysAfterDischarge: 29 });
    expect(bad.success).toBe(false);
    const messages = bad.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    expect(messages).toEqual(expect.arrayContaining([
      'items.0.key: This code is kept for the approved setting',
      'items: Each item needs its own code',
      'items.3.familySees: Families see only family training and home safety items',
      'firstVisitDaysAfterDischarge: At most 28',
    ]));
  });
});
