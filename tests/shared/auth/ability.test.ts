import { describe, expect, it } from 'vitest';
import { subject } from '@casl/ability';
import { defineAbilityFor, type Action, type SubjectName } from '@shared/auth/ability';
import type { Role } from '@shared/auth/roles';

const P = '11111111-1111-4111-8111-111111111111';
const OTHER = '22222222-2222-4222-8222-222222222222';
const ME = '33333333-3333-4333-8333-333333333333';
const BABY = '44444444-4444-4444-8444-444444444444';

const userFor = (role: Role) => ({ id: ME, role, programmeId: P, infantIds: role === 'family' ? [BABY] : [] });

// Each row: role, action, subject, record fields, expected. Walks every role against the rules in the brief.
const rows: Array<[Role, Action, SubjectName, Record<string, unknown>, boolean]> = [];
const roles: Role[] = ['admin', 'coordinator', 'nurse', 'consultant', 'family'];
const allow = (r: Role[], action: Action, s: SubjectName, rec: Record<string, unknown>) =>
  roles.forEach((role) => rows.push([role, action, s, rec, r.includes(role)]));

allow(['admin'], 'create', 'User', { programmeId: P });
allow(['admin'], 'disable', 'User', { programmeId: P });
allow([], 'disable', 'User', { programmeId: OTHER });
allow(['admin', 'coordinator', 'nurse', 'consultant'], 'read', 'User', { programmeId: P });
allow([], 'read', 'User', { programmeId: OTHER });
allow(['admin', 'coordinator', 'consultant'], 'read', 'Infant', { programmeId: P, id: 'x', nurseId: 'someone-else' });
allow(['admin', 'coordinator', 'nurse', 'consultant', 'family'], 'read', 'Infant', { programmeId: P, id: BABY, nurseId: ME });
allow([], 'read', 'Infant', { programmeId: OTHER, id: BABY, nurseId: ME });
allow(['coordinator'], 'create', 'Infant', { programmeId: P });
allow(['coordinator'], 'update', 'Infant', { programmeId: P });
allow(['consultant'], 'approve', 'Prescription', { programmeId: P, infantId: BABY, nurseId: ME });
allow([], 'approve', 'Prescription', { programmeId: OTHER, infantId: BABY });
allow(['admin', 'coordinator', 'consultant', 'nurse', 'family'], 'read', 'Prescription', { programmeId: P, infantId: BABY, nurseId: ME, status: 'active' });
allow(['admin', 'coordinator', 'consultant', 'nurse'], 'read', 'Prescription', { programmeId: P, infantId: BABY, nurseId: ME, status: 'proposed' });
allow(['admin'], 'update', 'Policy', { programmeId: P });
allow(['coordinator', 'consultant', 'nurse'], 'create', 'ConversionPreview', {});
allow(['admin', 'coordinator', 'consultant'], 'read', 'AuditEvent', { programmeId: P });
allow([], 'update', 'AuditEvent', { programmeId: P });

describe('ability matrix (role × action × subject)', () => {
  it.each(rows)('%s may %s %s %o → %s', (role, action, s, rec, expected) => {
    const ability = defineAbilityFor(userFor(role));
    expect(ability.can(action, subject(s, { ...rec }))).toBe(expected);
  });

  it('when nobody is signed in, then nothing is allowed', () => {
    const ability = defineAbilityFor(null);
    expect(ability.can('read', 'Programme')).toBe(false);
    expect(ability.rules).toHaveLength(0);
  });
});
