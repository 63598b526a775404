import { Router } from 'express';
import { MESSAGE_TEMPLATE_LABELS, listMessagesQuerySchema, type ListMessagesQuery, type Message } from '@shared/schemas/messages';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { assertCanAny, currentUser } from '../../lib/http';
import { isoInZone, type CsvColumn, sendCsv } from '../../lib/csv';
import { auditRead } from '../audit/read-audit';
import { todayIn } from '../../lib/dates';
import type { MessagesService } from './messages.service';

const STATUS_WORDS: Record<Message['status'], string> = {
  scheduled: 'Scheduled', sent: 'Sent', failed: 'Failed', skipped: 'Skipped', cancelled: 'Cancelled', unknown: 'Outcome unknown',
};

const columns = (timeZone: string): CsvColumn<Message>[] => [
  { heading: `Due to send (ISO 8601, ${timeZone})`, value: (m) => isoInZone(m.sendAt, timeZone) },
  { heading: `Sent at (ISO 8601, ${timeZone})`, value: (m) => isoInZone(m.sentAt, timeZone) },
  { heading: 'Status', value: (m) => STATUS_WORDS[m.status] },
  { heading: 'Why', value: (m) => m.reason },
  { heading: 'Message', value: (m) => MESSAGE_TEMPLATE_LABELS[m.template] },
  { heading: 'Channel', value: (m) => (m.channel === 'sms' ? 'SMS' : m.channel === 'email' ? 'E-mail' : '') },
  { heading: 'Recipient', value: (m) => m.recipient.name },
  { heading: 'Recipient is', value: (m) => (m.recipient.kind === 'family' ? 'Family' : 'Staff') },
  { heading: 'Address or number', value: (m) => m.recipient.address },
  { heading: 'Baby', value: (m) => m.infant?.name },
  { heading: 'Attempts', value: (m) => m.attempts },
  { heading: 'Last error', value: (m) => m.lastError },
  { heading: `Created at (ISO 8601, ${timeZone})`, value: (m) => isoInZone(m.createdAt, timeZone) },
  { heading: 'Message id', value: (m) => m.id },
];

/** GET /api/messages.csv: the message log with its filters and search, every matching message. */
export function messagesCsvRouter(service: MessagesService): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/', validate({ query: listMessagesQuerySchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Message');
    const user = currentUser(req);
    const rows = service.exportRows(req.ability, user.programmeId, req.query as unknown as ListMessagesQuery, user.programmeCountry);
    await auditRead(req, { action: 'messages.exported' });
    await sendCsv(res, `messages-${todayIn(user.programmeTimeZone)}.csv`, columns(user.programmeTimeZone), rows);
  });
  return r;
}
