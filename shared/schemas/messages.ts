import { z } from 'zod';
import { cursorPagedSchema, cursorQueryShape, pageQuerySchema, plainText } from './common';

// Every message Nestflow sends is first a row (a "reminder") written with the change that causes it.
export const MESSAGE_TEMPLATES = [
  'visit-booked',
  'visit-today',
  'visit-day-before',
  'visit-morning',
  'visit-moved',
  'visit-cancelled',
  'journey-day-before',
  'nurse-digest',
  'consultant-digest',
  'delivery-failed',
] as const;
export type MessageTemplate = (typeof MESSAGE_TEMPLATES)[number];
export const MESSAGE_TEMPLATE_LABELS: Record<MessageTemplate, string> = {
  'visit-booked': 'Visit booked (family)',
  'visit-today': 'Visit booked for today (family)',
  'visit-day-before': 'Visit tomorrow (family)',
  'visit-morning': 'Visit today (family)',
  'visit-moved': 'Visit moved (family)',
  'visit-cancelled': 'Visit cancelled (family)',
  'journey-day-before': 'Journey tomorrow (family)',
  'nurse-digest': "Nurse's morning list",
  'consultant-digest': 'Proposals waiting for sign-off',
  'delivery-failed': 'A family message failed (coordinator)',
};

export const CHANNELS = ['sms', 'email'] as const;
export type Channel = (typeof CHANNELS)[number];

/**
 * scheduled → sent | failed | skipped | cancelled | unknown. 'unknown': an e-mail attempt may or may not have
 * reached the provider and no mail search could tell; it waits for a coordinator instead of going twice.
 */
export const MESSAGE_STATUSES = ['scheduled', 'sent', 'failed', 'skipped', 'cancelled', 'unknown'] as const;
export type MessageStatus = (typeof MESSAGE_STATUSES)[number];

/** Why a message was skipped or cancelled, in words staff can act on. */
export const SKIP_REASONS = {
  'no-consent': 'No consent for any channel we have an address for',
  'opted-out': 'The family turned reminders off',
  'quiet-hours': 'Would have fallen in quiet hours and been too late after them',
  'nothing-to-send': 'Nothing to report at send time',
  'visit-changed': 'The visit was moved or cancelled',
  'no-longer-needed': 'No longer needed',
  'outcome-unknown': 'Outcome unknown — check before sending again',
} as const;
export type SkipReason = keyof typeof SKIP_REASONS;

export const MESSAGE_SORTS = ['sendAt', '-sendAt', 'status', '-status'] as const;

export const listMessagesQuerySchema = pageQuerySchema.extend({
  sort: z.enum(MESSAGE_SORTS, { error: 'Unknown sort' }).default('-sendAt'),
  status: z.enum(MESSAGE_STATUSES, { error: 'Unknown status' }).optional(),
  channel: z.enum(CHANNELS, { error: 'Unknown channel' }).optional(),
  template: z.enum(MESSAGE_TEMPLATES, { error: 'Unknown message type' }).optional(),
  infantId: z.uuid({ error: 'Must be a valid id' }).optional(),
  /** Part of the baby's name, the recipient's name, or their address or number. */
  q: plainText().trim().max(100, { error: 'At most 100 characters' }).optional(),
  ...cursorQueryShape,
});
export type ListMessagesQuery = z.infer<typeof listMessagesQuerySchema>;

export const messageSchema = z.object({
  id: z.uuid(),
  template: z.enum(MESSAGE_TEMPLATES),
  channel: z.enum(CHANNELS).nullable(),
  status: z.enum(MESSAGE_STATUSES),
  reason: z.string().nullable(),
  recipient: z.object({ kind: z.enum(['family', 'staff']), name: z.string(), address: z.string().nullable() }),
  infant: z.object({ id: z.uuid(), name: z.string() }).nullable(),
  /** When it is (or was) due to go, after quiet hours. */
  sendAt: z.string(),
  sentAt: z.string().nullable(),
  attempts: z.number().int(),
  providerId: z.string().nullable(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
});
export type Message = z.infer<typeof messageSchema>;
export const messagesPageSchema = cursorPagedSchema(messageSchema);
export type MessagesPage = z.infer<typeof messagesPageSchema>;
export const messageResponseSchema = z.object({ message: messageSchema });
