import type { Message, MessageStatus } from '@shared/schemas/messages';
import { Badge } from '../../../components/ui/badge';
import { MESSAGE_STATUS_LABELS, statusDetail } from './message-format';

type Tone = Parameters<typeof Badge>[0]['tone'];
const TONES: Record<MessageStatus, Tone> = { scheduled: 'brand', sent: 'ok', failed: 'danger', skipped: 'warn', cancelled: 'muted', unknown: 'danger' };

export function MessageStatusCell({ message }: { message: Message }) {
  const detail = statusDetail(message);
  return (
    <span className="flex max-w-64 flex-col items-start gap-1">
      <Badge tone={TONES[message.status]}>{MESSAGE_STATUS_LABELS[message.status]}</Badge>
      {detail && <span className="text-sm text-ink-700">{detail}</span>}
    </span>
  );
}
