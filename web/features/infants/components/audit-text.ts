import { PRESCRIPTION_REASON_LABELS } from '../../../../shared/schemas/prescriptions';
import type { AuditEvent } from '../api/get-infant-audit';
import { flowText } from './record-format';

const FIELD_WORDS: Record<string, string> = {
  weightKg: 'weight',
  weightDate: 'weighing date',
  homeAddress: 'home address',
  homeLocation: 'home elevation or pressure',
  homeSource: 'home oxygen source',
  homeO2Percent: 'home oxygen %',
  nurseId: 'nurse',
  consultantId: 'consultant',
};

type Details = Record<string, unknown>;
const num = (value: unknown) => (typeof value === 'number' ? value : null);

function changedFields(details: Details): string {
  const changes = (details.changes ?? {}) as Record<string, { from?: unknown; to?: unknown }>;
  const words = Object.entries(changes).map(([field, change]) => {
    const word = FIELD_WORDS[field] ?? field;
    return field === 'weightKg' && num(change.from) !== null && num(change.to) !== null ? `${word} ${change.from} → ${change.to} kg` : word;
  });
  return words.length ? words.join(', ') : 'no fields';
}

function reasonWords(reason: unknown): string {
  return typeof reason === 'string' && reason in PRESCRIPTION_REASON_LABELS
    ? PRESCRIPTION_REASON_LABELS[reason as keyof typeof PRESCRIPTION_REASON_LABELS].toLowerCase()
    : 'no reason recorded';
}

/** What happened, in plain words, for the actions the record knows; anything else shows its code. */
export function auditText(event: AuditEvent): string {
  const details: Details = event.details ?? {};
  const version = num(details.version);
  const v = version === null ? 'a version' : `version ${version}`;
  switch (event.action) {
    case 'infant.enrolled':
      return 'Enrolled the baby';
    case 'infant.updated':
      return `Changed the record: ${changedFields(details)}`;
    case 'infant.contacts_changed': {
      const after = Array.isArray(details.after) ? details.after.length : null;
      return after === null ? 'Changed the family contacts' : `Changed the family contacts (now ${after})`;
    }
    case 'prescription.requested':
      return `Asked for a new home setting, ${v} (${reasonWords(details.reason)})`;
    case 'prescription.proposed':
      return details.feasible === false
        ? `Worked out ${v}: no low-flow setting reaches the target`
        : `Worked out ${v}: proposed ${flowText(num(details.proposedFlowLpm))}`;
    case 'prescription.approved':
      return `Approved ${v} at ${flowText(num(details.approvedFlowLpm))}${typeof details.reason === 'string' && details.reason ? ` (${details.reason})` : ''}`;
    case 'prescription.rejected':
      return `Sent back ${v}${typeof details.reason === 'string' && details.reason ? `: ${details.reason}` : ''}`;
    case 'prescription.step_down_proposed':
      return `Proposed a step down, ${v}: ${flowText(num(details.flowLpm))}`;
    case 'prescription.step_up_proposed':
      return `Proposed stepping back up, ${v}: ${flowText(num(details.flowLpm))}`;
    case 'prescription.leave_programme_proposed':
      return `Proposed leaving the programme, ${v}`;
    case 'reading.logged':
      return 'Logged a spot reading';
    case 'reading.family_reported':
      return 'Family reported a home reading';
    case 'reading.corrected':
      return 'Corrected a spot reading';
    case 'recording.uploaded':
      return `Uploaded an overnight recording${typeof details.fileName === 'string' ? ` (${details.fileName})` : ''}`;
    case 'recording.analysed':
      return 'Analysed an overnight recording';
    case 'recording.failed':
      return 'An overnight recording could not be analysed';
    default:
      return event.action;
  }
}
