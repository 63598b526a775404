import { SKIP_REASONS, type Channel, type Message, type MessageStatus } from '@shared/schemas/messages';

export const MESSAGE_STATUS_LABELS: Record<MessageStatus, string> = {
  scheduled: 'Waiting to send',
  sent: 'Sent',
  failed: 'Failed',
  skipped: 'Not sent',
  cancelled: 'Called off',
  unknown: 'Outcome unknown — check before sending again',
};

export const CHANNEL_LABELS: Record<Channel, string> = { sms: 'SMS', email: 'E-mail' };

export const channelText = (channel: Channel | null) => (channel ? CHANNEL_LABELS[channel] : '—');

const isSkipReason = (reason: string): reason is keyof typeof SKIP_REASONS => Object.hasOwn(SKIP_REASONS, reason);

/** The server stores a reason code for skips and cancellations; anything else it sends is already words. */
export function reasonText(reason: string | null): string | null {
  if (!reason) return null;
  return isSkipReason(reason) ? SKIP_REASONS[reason] : reason;
}

/** Why the message is in its state, so the status never rests on its colour or one word alone. */
export function statusDetail(message: Pick<Message, 'status' | 'reason' | 'lastError'>): string | null {
  switch (message.status) {
    case 'failed':
      return message.lastError ?? reasonText(message.reason) ?? 'No reason was recorded';
    case 'skipped':
    case 'cancelled':
      return reasonText(message.reason);
    case 'scheduled':
      return message.lastError ? `Last try failed: ${message.lastError}` : null;
    case 'unknown':
      return `It may already have reached them${message.lastError ? ` (${message.lastError})` : ''}.`;
    case 'sent':
      return null;
  }
}

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (!formatter) {
    try {
      formatter = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone });
    } catch {
      // An unknown zone name must not break the whole log; the browser's own zone is the fallback.
      formatter = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
    }
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

/** "1 Jul 2026, 17:00" on the programme's clock, whatever zone the browser is in. */
export function formatProgrammeTime(iso: string, timeZone: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '—' : formatterFor(timeZone).format(date);
}
