import { describe, expect, it } from 'vitest';
import { defineAbilityFor } from '@shared/auth/ability';
import { accessibleWhere, readsEveryInfantOf } from '../../server/auth/casl-to-sql';

const P = '11111111-1111-4111-8111-111111111111';
const cols = { programmeId: 'i.programme_id', nurseId: 'i.nurse_id', id: 'i.id', infantId: 'i.infant_id', status: 'i.status' };

describe('CASL rules → SQL', () => {
  it('when the role has no rule, then the filter matches nothing', () => {
    const f = accessibleWhere(defineAbilityFor({ id: 'u', role: 'family', programmeId: P, infantIds: [] }), 'create', 'Infant', cols);
    expect(f.sql).toBe('1=0');
  });

  it('when a nurse reads infants, then programme and caseload are both bound as parameters', () => {
    const f = accessibleWhere(defineAbilityFor({ id: 'nurse-1', role: 'nurse', programmeId: P }), 'read', 'Infant', cols);
    expect(f.sql).toMatch(/i\.programme_id = :acl\d/);
    expect(f.sql).toMatch(/i\.nurse_id = :acl\d/);
    expect(Object.values(f.params).sort()).toEqual([P, 'nurse-1'].sort());
    expect(f.sql).not.toContain(P);
  });

  it('when a family reads infants, then an IN list of their own babies is used; an empty list matches nothing', () => {
    const f = accessibleWhere(defineAbilityFor({ id: 'f', role: 'family', programmeId: P, infantIds: ['b1', 'b2'] }), 'read', 'Infant', cols);
    expect(f.sql).toMatch(/i\.id IN \(:\.\.\.acl\d\)/);
    expect(Object.values(f.params)).toContainEqual(['b1', 'b2']);
    const none = accessibleWhere(defineAbilityFor({ id: 'f', role: 'family', programmeId: P, infantIds: [] }), 'read', 'Infant', cols);
    expect(none.sql).toContain('1=0');
  });

  it('when a rule uses a field with no column mapping, then it throws instead of widening access', () => {
    expect(() => accessibleWhere(defineAbilityFor({ id: 'n', role: 'nurse', programmeId: P }), 'read', 'Infant', { programmeId: 'x' })).toThrow(/nurseId/);
  });

  it('when asked who may read every baby of a programme, then staff who read the whole programme may; a nurse, a family or another programme may not', () => {
    const OTHER = '22222222-2222-4222-8222-222222222222';
    for (const role of ['admin', 'coordinator', 'consultant'] as const) {
      const ability = defineAbilityFor({ id: 'u', role, programmeId: P });
      expect(readsEveryInfantOf(ability, P), role).toBe(true);
      expect(readsEveryInfantOf(ability, OTHER), `${role} in another programme`).toBe(false);
    }
    expect(readsEveryInfantOf(defineAbilityFor({ id: 'nurse-1', role: 'nurse', programmeId: P }), P)).toBe(false);
    expect(readsEveryInfantOf(defineAbilityFor({ id: 'f', role: 'family', programmeId: P, infantIds: ['b1'] }), P)).toBe(false);
    expect(readsEveryInfantOf(defineAbilityFor(null), P)).toBe(false);
  });
});
