/**
 * Every action the API, the worker and the demo seed write to `audit_events`, as stored. A new action goes here and gets its
 * sentence in `audit-words.ts` (the type makes a missing one a compile error; tests/shared/audit-words.test.ts
 * also reads the server's source and fails on an action missing from this list).
 */
/** Reads of a baby's clinical record (kind 'read' in `audit_events`), written by `auditRead` (server/modules/audit/read-audit.ts). */
export const READ_ACTIONS = [
  'infant.viewed', 'infant.plans_viewed', 'prescription.viewed', 'infant.readings_viewed', 'infant.recordings_listed',
  'recording.viewed', 'recording.trace_viewed', 'infant.journeys_viewed', 'journey.viewed', 'infant.care_plan_printed',
  'infant.fhir_exported', 'infant.readings_exported', 'caseload.exported', 'messages.exported', 'infant.discharge_letter_printed',
] as const;
export type ReadAction = (typeof READ_ACTIONS)[number];

export const AUDIT_ACTIONS = [
  'infant.enrolled', 'infant.updated', 'infant.contacts_changed',
  'prescription.requested', 'prescription.proposed', 'prescription.approved', 'prescription.rejected',
  'prescription.step_down_proposed', 'prescription.step_up_proposed', 'prescription.leave_programme_proposed',
  'step_down.requested_against_rules',
  'reading.logged', 'reading.family_reported', 'reading.corrected',
  'recording.uploaded', 'recording.analysed', 'recording.reanalysed', 'recording.failed',
  'journey.requested', 'journey.approved', 'journey.declined',
  'visit.booked', 'visit.moved', 'visit.cancelled', 'visit.done',
  'equipment_order.drafted', 'equipment_order.sent', 'equipment_order.send_failed', 'equipment_order.confirmed', 'equipment_order.delivered',
  'equipment_order.cancelled',
  'contact.preferences_changed', 'contact.sms_stopped',
  'message.retried', 'message.confirmed-arrived',
  'policy.changed',
  'discharge.item_changed', 'discharge.date_set', 'discharge.date_overridden', 'discharge.letter_emailed',
  'user.created', 'user.invited', 'user.invitation_resent', 'user.invite_existing_address', 'user.setup_link_sent', 'user.enabled', 'user.disabled',
  'user.password_set', 'user.password_changed', 'user.password_change_failed',
  'session.signed_in', 'session.signed_out', 'session.sign_in_failed', 'session.sign_in_blocked', 'session.owner_alerted',
  ...READ_ACTIONS,
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export const isAuditAction = (action: string): action is AuditAction => (AUDIT_ACTIONS as readonly string[]).includes(action);

export const isReadAction = (action: string): action is ReadAction => (READ_ACTIONS as readonly string[]).includes(action);
