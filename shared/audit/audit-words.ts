import { MESSAGE_TEMPLATE_LABELS } from '../schemas/messages';
import { PRESCRIPTION_REASON_LABELS } from '../schemas/prescriptions';
import { READING_STATE_LABELS } from '../schemas/readings';
import { VISIT_KIND_LABELS } from '../schemas/visits';
import { AUDIT_ACTIONS, isAuditAction, type AuditAction } from './audit-actions';
import { contactsWords, preferencesWords, recordChanges } from './audit-changes';
import { dayWords, flowWords, joinWords, list, num, obj, settingWords, str, type Details } from './audit-format';
import { numberInWords } from '../format/number-words';

/** Names of the people a stored id points at (staff on a visit, a new nurse), as the API resolved them. */
export type PeopleNames = Readonly<Record<string, string>>;
type Words = (details: Details, people: PeopleNames) => string;

const personWords = (id: unknown, people: PeopleNames) => {
  const key = str(id);
  return key === null ? 'nobody' : people[key] || 'someone no longer listed';
};
const versionWords = (d: Details) => (num(d.version) === null ? 'a version' : `version ${num(d.version)}`);
const because = (reason: unknown, lead = ': ') => (str(reason) ? `${lead}${str(reason)}` : '');
const reasonLabel = (reason: unknown) => {
  const key = str(reason);
  return key && key in PRESCRIPTION_REASON_LABELS ? PRESCRIPTION_REASON_LABELS[key as keyof typeof PRESCRIPTION_REASON_LABELS].toLowerCase() : 'no reason recorded';
};

const RULE_WORDS: Record<string, string> = {
  time_on_setting: 'long enough on the current setting',
  study_judged: 'a recent study long enough to judge',
  study_on_target: 'the latest study on target',
  no_open_flags: 'no open low-SpO2 or overdue-check flag',
  readings_in_range: 'recent readings in range',
  weight_not_falling: 'weight not falling',
};
const rulesWords = (codes: unknown) => joinWords(list(codes).map((c) => RULE_WORDS[String(c)] ?? String(c).replace(/_/g, ' ')));

function readingFigures(d: Details): string {
  const parts = [
    num(d.spo2) !== null ? `SpO2 ${num(d.spo2)} %` : null,
    num(d.pulse) !== null ? `pulse ${num(d.pulse)}/min` : null,
    num(d.flowLpm) !== null ? `flow ${flowWords(d.flowLpm)}` : null,
    str(d.state) && str(d.state)! in READING_STATE_LABELS ? READING_STATE_LABELS[str(d.state) as keyof typeof READING_STATE_LABELS].toLowerCase() : null,
  ].filter((p): p is string => p !== null);
  return parts.length ? `: ${parts.join(', ')}` : '';
}

const READING_FIELD_WORDS: Record<string, [string, string]> = {
  spo2: ['SpO2', '%'], pulse: ['pulse', '/min'], flowLpm: ['flow', 'L/min'], state: ['state', ''], notes: ['notes', ''],
};
function readingCorrection(d: Details): string {
  const before = obj(d.before) ?? {};
  const after = obj(d.after);
  if (!after) return `Corrected a spot reading (it read${readingFigures(before).slice(1) || ' nothing recorded'} before)`;
  const changes = Object.keys(READING_FIELD_WORDS)
    .filter((key) => key in after && JSON.stringify(before[key] ?? null) !== JSON.stringify(after[key] ?? null))
    .map((key) => {
      const [word, unit] = READING_FIELD_WORDS[key];
      if (key === 'notes') return 'notes changed';
      const show = (v: unknown) => (v === null || v === undefined ? 'nothing' : `${String(v)}${unit === '/min' ? unit : unit ? ` ${unit}` : ''}`);
      return `${word} from ${show(before[key])} to ${show(after[key])}`;
    });
  return `Corrected a spot reading: ${changes.length ? changes.join(', ') : 'no figure changed'}`;
}

const tripWords = (d: Details) => (str(d.destinationName) ? ` for ${str(d.destinationName)}${str(d.departOn) ? ` (leaving ${dayWords(d.departOn)})` : ''}` : '');
const timeWords = (date: unknown, time: unknown) => `${dayWords(date)}${str(time) ? ` at ${str(time)}` : ''}`;

function visitMoved(d: Details, people: PeopleNames): string {
  const before = obj(d.before) ?? {};
  const after = obj(d.after) ?? {};
  const parts: string[] = [];
  if (before.date !== after.date || before.time !== after.time) parts.push(`from ${timeWords(before.date, before.time)} to ${timeWords(after.date, after.time)}`);
  if (str(after.staffId) && before.staffId !== after.staffId) parts.push(`now with ${personWords(after.staffId, people)} (was ${personWords(before.staffId, people)})`);
  return `Moved a visit${parts.length ? ` ${parts.join('; ')}` : ': nothing changed'}`;
}

const template = (d: Details) => {
  const key = str(d.template);
  return key && key in MESSAGE_TEMPLATE_LABELS ? `“${MESSAGE_TEMPLATE_LABELS[key as keyof typeof MESSAGE_TEMPLATE_LABELS]}”` : 'a';
};
const roleWords = (role: unknown) => (str(role) ? `a ${String(role)}` : 'a person');
const SIGN_IN_FAILURES: Record<string, string> = {
  unknown_account: 'no account has that e-mail address', disabled: 'the account is switched off', not_set_up: 'the password was never set', wrong_password: 'wrong password',
};

const WORDS: Record<AuditAction, Words> = {
  'infant.enrolled': () => 'Enrolled the baby',
  'infant.updated': (d, people) => `Changed the record: ${recordChanges(d, people)}${d.growthDrift === true ? '; the baby is now flagged as outgrowing the flow' : ''}`,
  'infant.contacts_changed': (d) => `Changed the family contacts: ${contactsWords(d)}`,
  'prescription.requested': (d) => `Asked for a new home setting, ${versionWords(d)} (${reasonLabel(d.reason)})`,
  'prescription.proposed': (d) => (d.feasible === false
    ? `Worked out ${versionWords(d)}: no low-flow setting reaches the target`
    : `Worked out ${versionWords(d)}: proposed ${flowWords(d.proposedFlowLpm)}`),
  'prescription.approved': (d) => {
    const changed = num(d.proposedFlowLpm) !== null && num(d.approvedFlowLpm) !== num(d.proposedFlowLpm) ? ` (proposed ${flowWords(d.proposedFlowLpm)})` : '';
    const against = list(d.approvedAgainstRules).length ? `; approved although not met: ${rulesWords(d.approvedAgainstRules)}` : '';
    return `Approved ${versionWords(d)} at ${flowWords(d.approvedFlowLpm)}${changed}${because(d.reason, ' — ')}${against}`;
  },
  'prescription.rejected': (d) => `Sent back ${versionWords(d)}${num(d.proposedFlowLpm) !== null ? ` (proposed ${flowWords(d.proposedFlowLpm)})` : ''}${because(d.reason)}`,
  'prescription.step_down_proposed': (d) => `Proposed a step down, ${versionWords(d)}: ${settingWords(d.flowLpm, d.periods)}`,
  'prescription.step_up_proposed': (d) => `Proposed stepping back up, ${versionWords(d)}: ${settingWords(d.flowLpm, d.periods)}`,
  'prescription.leave_programme_proposed': (d) => `Proposed leaving the programme, ${versionWords(d)}`,
  'step_down.requested_against_rules': (d) => `Asked for a step down although not met: ${rulesWords(d.unmet) || 'a programme rule'}${because(d.overrideReason, '. Reason given: ')}`,
  'reading.logged': (d) => `Logged a spot reading${readingFigures(d)}${str(d.checkId) ? ' (a planned check)' : ''}`,
  'reading.family_reported': (d) => `Family reported a home reading${readingFigures(d)}`,
  'reading.corrected': (d) => readingCorrection(d),
  'recording.uploaded': (d) => {
    const facts = [str(d.fileName), num(d.sampleCount) !== null ? `${numberInWords(num(d.sampleCount)!)} samples` : null,
      num(d.skippedRows) ? `${num(d.skippedRows)} unreadable rows skipped` : null].filter(Boolean);
    return `Uploaded an overnight recording${facts.length ? ` (${facts.join(', ')})` : ''}`;
  },
  'recording.analysed': (d) => {
    const valid = num(d.validSampleCount) !== null && num(d.sampleCount) !== null
      ? `: ${numberInWords(num(d.validSampleCount)!)} of ${numberInWords(num(d.sampleCount)!)} samples valid` : '';
    const judged = d.judged === false ? ', too short to judge' : d.judged === true ? ', long enough to judge' : '';
    return `Analysed an overnight recording${valid}${judged}`;
  },
  'recording.reanalysed': (d) => `Analysed an overnight recording again with the updated rules (version ${str(d.previousVersion) ?? num(d.previousVersion) ?? '?'} → ${str(d.analysisVersion) ?? num(d.analysisVersion) ?? '?'})${d.judged === false ? ', too short to judge' : ''}`,
  'recording.failed': (d) => `An overnight recording could not be analysed${because(d.reason)}`,
  'journey.requested': (d) => `Asked for a journey check: ${d.mode === 'flight' ? 'flight' : 'by road'} to ${str(d.destinationName) ?? 'a destination'}, ${dayWords(d.departOn)} to ${dayWords(d.returnOn)}${d.exceedsCannula === true ? '; the flow there is beyond a cannula' : ''}`,
  'journey.approved': (d) => `Approved the journey check${tripWords(d)}${because(d.reason, ' — ')}`,
  'journey.declined': (d) => `Declined the journey check${tripWords(d)}${because(d.reason)}`,
  'visit.booked': (d) => `Booked a ${str(d.kind) && str(d.kind)! in VISIT_KIND_LABELS ? VISIT_KIND_LABELS[str(d.kind) as keyof typeof VISIT_KIND_LABELS].toLowerCase() : 'visit'} for ${timeWords(d.date, d.time)}`,
  'visit.moved': visitMoved,
  'visit.done': (d) => `Marked a visit done${str(d.date) ? ` (${timeWords(d.date, d.time)})` : ''}`,
  'visit.cancelled': (d) => `Cancelled a visit${str(d.date) ? ` for ${timeWords(d.date, d.time)}` : ''}${because(d.reason)}`,
  'equipment_order.drafted': (d) => `${d.automatic === true ? 'Nestflow drafted' : 'Drafted'} equipment order ${str(d.reference) ?? ''}${str(d.purpose) === 'collection' ? ' (collection)' : str(d.purpose) === 'change' ? ' (change of equipment)' : ''}${str(d.neededBy) ? `, needed by ${dayWords(d.neededBy)}` : ''}${because(d.reason)}`,
  'equipment_order.sent': (d) => `Sent equipment order ${str(d.reference) ?? ''} to the supplier${str(d.to) ? ` (${str(d.to)})` : ''}`,
  'equipment_order.send_failed': (d) => `Equipment order ${str(d.reference) ?? ''} could not be sent${because(d.reason)}`,
  'equipment_order.confirmed': (d) => `The supplier confirmed delivery of order ${str(d.reference) ?? ''} for ${dayWords(d.deliveryOn)}${str(d.before) ? ` (was ${dayWords(d.before)})` : ''}`,
  'equipment_order.delivered': (d) => `The supplier recorded order ${str(d.reference) ?? ''} as delivered`,
  'equipment_order.cancelled': (d) => `Cancelled equipment order ${str(d.reference) ?? ''}${because(d.reason)}`,
  'contact.preferences_changed': (d) => `Family changed their contact preferences: ${preferencesWords(d)}`,
  'contact.sms_stopped': (d) => `Family replied ${str(d.word) ? `“${str(d.word)}” ` : ''}by SMS: no more text messages to that number`,
  'message.retried': (d) => `Sent ${template(d)} message again`,
  'message.confirmed-arrived': (d) => `Recorded that ${template(d)} message did arrive`,
  'policy.changed': (d) => `Changed the programme settings${num(d.version) !== null ? ` (version ${num(d.version)})` : ''}${list(d.changed).length ? `: ${list(d.changed).map(String).join(', ')}` : ''}`,
  'discharge.item_changed': (d) => `${d.done === true ? 'Ticked' : 'Unticked'} the discharge checklist item “${str(d.label) ?? str(d.key) ?? 'an item'}”${str(d.note) ? ` (note: ${str(d.note)})` : ''}`,
  'discharge.date_set': (d) => `Set the discharge date to ${dayWords(d.date)}${str(d.firstVisitOn) ? `; first home visit proposed for ${dayWords(d.firstVisitOn)}` : ''}`,
  'discharge.date_overridden': (d) => `Set the discharge date to ${dayWords(d.date)} with ${list(d.missing).length} checklist step${list(d.missing).length === 1 ? '' : 's'} not done${because(d.reason, '. Reason given: ')}`,
  'discharge.letter_emailed': (d) => `E-mailed the discharge letter${str(d.to) ? ` to ${str(d.to)}` : ''}`,
  'user.created': (d) => `Created the account of ${roleWords(d.role)}${str(d.by) === 'demo-seed' ? ' (demo set-up)' : ''}`,
  'user.invited': (d) => `Added ${roleWords(d.role)} and sent a set-up link`,
  'user.invitation_resent': (d) => `Sent ${roleWords(d.role)} a new set-up link`,
  'user.invite_existing_address': (d) => `Tried to add ${roleWords(d.role)} with an address that already has an account; its owner was told`,
  'user.setup_link_sent': () => 'Sent a new set-up link; the old password and sessions ended',
  'user.enabled': () => 'Switched the account back on',
  'user.disabled': () => 'Switched the account off',
  'user.password_set': () => 'Chose a password from a set-up link',
  'user.password_changed': () => 'Changed their password',
  'user.password_change_failed': () => 'Tried to change their password with a wrong current password',
  'session.signed_in': () => 'Signed in',
  'session.signed_out': () => 'Signed out',
  'session.sign_in_failed': (d) => `A sign-in was refused${str(d.reason) ? `: ${SIGN_IN_FAILURES[str(d.reason)!] ?? str(d.reason)}` : ''}`,
  'session.sign_in_blocked': (d) => `Sign-in attempts were paused after too many failures${num(d.retryAfterSeconds) !== null ? ` (for ${Math.ceil(num(d.retryAfterSeconds)! / 60)} min)` : ''}`,
  'session.owner_alerted': (d) => `E-mailed the account's owner about ${num(d.failures) ?? 'several'} failed sign-ins`,
  'infant.viewed': () => 'Opened the baby\'s record',
  'infant.plans_viewed': () => 'Looked at the home setting versions',
  'prescription.viewed': (d) => `Opened ${versionWords(d)} of the home setting`,
  'infant.readings_viewed': () => 'Looked at the spot readings',
  'infant.recordings_listed': () => 'Looked at the list of overnight recordings',
  'recording.viewed': () => 'Opened an overnight recording',
  'recording.trace_viewed': () => 'Looked at the trace of an overnight recording',
  'infant.journeys_viewed': () => 'Looked at the journey checks',
  'journey.viewed': () => 'Opened a journey check',
  'infant.care_plan_printed': () => 'Downloaded the printable care plan',
  'infant.fhir_exported': () => 'Downloaded the record as FHIR',
  'infant.readings_exported': () => 'Downloaded the spot readings as a CSV file',
  'caseload.exported': () => 'Downloaded the caseload as a CSV file',
  'messages.exported': () => 'Downloaded the message log as a CSV file',
  'infant.discharge_letter_printed': () => 'Downloaded the discharge letter',
};

/** One audit line in words with what changed; an action this version does not know says so rather than show a code. */
export function auditWords(action: string, details: Details | null | undefined, people: PeopleNames = {}): string {
  if (!isAuditAction(action)) return 'A change this version of Nestflow cannot describe';
  return WORDS[action](details ?? {}, people);
}

export { AUDIT_ACTIONS };
