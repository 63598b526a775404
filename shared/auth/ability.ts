import { AbilityBuilder, createMongoAbility, type MongoAbility } from '@casl/ability';
import type { Role } from './roles';

export const ACTIONS = ['manage', 'read', 'create', 'update', 'disable', 'approve', 'log'] as const;
export type Action = (typeof ACTIONS)[number];

export const SUBJECTS = [
  'Programme',
  'User',
  'AuditEvent',
  'Infant',
  'Prescription',
  'ConversionPreview',
  'Policy',
  'Reading',
  'Recording',
  'Visit',
  'Message',
  'Journey',
  'StepDown',
  'Preferences',
  /** Who opened a baby's record (the read trail), and the verification of the audit hash chain: admins only. */
  'AccessLog',
  'AuditChain',
  /** The discharge checklist and date of a baby (the fields of the baby it belongs to). */
  'Discharge',
  'EquipmentOrder',
] as const;
export type SubjectName = (typeof SUBJECTS)[number];

export type AppAbility = MongoAbility<[Action, SubjectName | 'all' | Record<string, unknown>]>;

/** What the ability needs to know about the signed-in person; nothing else leaks into rules. */
export interface AbilityUser {
  id: string;
  role: Role;
  programmeId: string;
  /** Babies a family account is linked to; empty for staff. */
  infantIds?: readonly string[];
}

type Builder = AbilityBuilder<AppAbility>;

const STAFF_READ_ALL: SubjectName[] = ['Infant', 'Prescription', 'Reading', 'Recording', 'Visit', 'Journey', 'EquipmentOrder'];

function adminRules({ can }: Builder, p: string) {
  can('read', 'Programme', { id: p });
  can(['read', 'create', 'update', 'disable'], 'User', { programmeId: p });
  can('read', 'AuditEvent', { programmeId: p });
  can('read', ['AccessLog', 'AuditChain'], { programmeId: p });
  can(['read', 'update'], 'Policy', { programmeId: p });
  can(['read', 'update'], 'Message', { programmeId: p });
  can('read', STAFF_READ_ALL, { programmeId: p });
  can('read', 'Discharge', { programmeId: p });
}

function coordinatorRules({ can }: Builder, p: string) {
  can('read', 'Programme', { id: p });
  can('read', 'User', { programmeId: p });
  can('read', 'Policy', { programmeId: p });
  can('read', 'AuditEvent', { programmeId: p });
  can('read', STAFF_READ_ALL, { programmeId: p });
  can(['create', 'update'], ['Infant', 'Visit', 'Journey'], { programmeId: p });
  can('create', ['Recording', 'Reading', 'StepDown'], { programmeId: p });
  // Ticks the discharge checklist and sets the date once everything is done.
  can(['read', 'update'], 'Discharge', { programmeId: p });
  // The message log, and sending a failed message again.
  can(['read', 'update'], 'Message', { programmeId: p });
  can('create', 'ConversionPreview');
  // Orders to the oxygen supplier: the coordinator makes, sends and cancels them (issue 16).
  can(['create', 'update'], 'EquipmentOrder', { programmeId: p });
}

function nurseRules({ can }: Builder, p: string, userId: string) {
  can('read', 'Programme', { id: p });
  can('read', 'User', { programmeId: p });
  can('read', 'Policy', { programmeId: p });
  // A nurse works on their own caseload: the infant rows assigned to them.
  can('read', 'Infant', { programmeId: p, nurseId: userId });
  can('read', ['Prescription', 'Reading', 'Recording', 'Visit', 'Journey', 'EquipmentOrder'], { programmeId: p, nurseId: userId });
  can('create', ['Reading', 'Recording', 'Visit', 'StepDown'], { programmeId: p, nurseId: userId });
  can('update', 'Visit', { programmeId: p, nurseId: userId });
  // The nurse trains the family and assesses the home: ticks those items for the babies of the caseload.
  can(['read', 'update'], 'Discharge', { programmeId: p, nurseId: userId });
  can('create', 'ConversionPreview');
}

function consultantRules({ can }: Builder, p: string) {
  can('read', 'Programme', { id: p });
  can('read', 'User', { programmeId: p });
  can('read', 'Policy', { programmeId: p });
  can('read', 'AuditEvent', { programmeId: p });
  can('read', STAFF_READ_ALL, { programmeId: p });
  can('approve', ['Prescription', 'Journey'], { programmeId: p });
  // Only a consultant may set a discharge date with something missing ('approve'), with a recorded reason.
  can(['read', 'update', 'approve'], 'Discharge', { programmeId: p });
  can('create', 'ConversionPreview');
}

function familyRules({ can }: Builder, p: string, infantIds: readonly string[]) {
  const own = { programmeId: p, infantId: { $in: [...infantIds] } };
  can('read', 'Programme', { id: p });
  // The programme's numbers to call and its cylinder list; the settings hold no one's personal data.
  can('read', 'Policy', { programmeId: p });
  can('read', 'Infant', { programmeId: p, id: { $in: [...infantIds] } });
  // Families only ever see an approved plan.
  can('read', 'Prescription', { ...own, status: 'active' });
  can('read', ['Visit', 'Journey'], own);
  can('create', ['Journey', 'Reading'], own);
  // Their own contact details, channel, consents, language and reminder switch.
  can(['read', 'update'], 'Preferences');
  // The checklist items that concern them, in plain words (the API filters the items).
  can('read', 'Discharge', own);
}

/** The one definition of who may do what; the API enforces it in routes and queries, the web only hides. */
export function defineAbilityFor(user: AbilityUser | null): AppAbility {
  const builder = new AbilityBuilder<AppAbility>(createMongoAbility);
  if (user) {
    const p = user.programmeId;
    switch (user.role) {
      case 'admin':
        adminRules(builder, p);
        break;
      case 'coordinator':
        coordinatorRules(builder, p);
        break;
      case 'nurse':
        nurseRules(builder, p, user.id);
        break;
      case 'consultant':
        consultantRules(builder, p);
        break;
      case 'family':
        familyRules(builder, p, user.infantIds ?? []);
        break;
    }
  }
  return builder.build();
}
