import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { MESSAGE_SORTS, MESSAGE_TEMPLATE_LABELS, type ListMessagesQuery, type Message } from '../../../../shared/schemas/messages';
import { urlSort } from '../../../components/ui/data-table/url-sort';
import type { ServerTableFeatures } from '../../../components/ui/data-table/use-server-table';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { channelText, formatProgrammeTime } from './message-format';
import { MessageStatusCell } from './message-status';
import { RetryMessageAction } from './retry-message-action';

const helper = createColumnHelper<ServerTableFeatures, Message>();

function SendTime({ message }: { message: Message }) {
  const { programmeTimeZone } = useSignedInUser();
  const sentLater = message.sentAt && message.sentAt.slice(0, 16) !== message.sendAt.slice(0, 16);
  return (
    <span className="flex flex-col whitespace-nowrap">
      <span>{formatProgrammeTime(message.sendAt, programmeTimeZone)}</span>
      {sentLater && <span className="text-sm text-ink-700">Sent {formatProgrammeTime(message.sentAt!, programmeTimeZone)}</span>}
    </span>
  );
}

function Recipient({ recipient }: { recipient: Message['recipient'] }) {
  return (
    <span className="flex flex-col">
      <span className="font-semibold">{recipient.name}</span>
      <span className="text-sm text-ink-700">
        {recipient.kind === 'family' ? 'Family' : 'Staff'}
        {recipient.address ? <> · <span className="break-all">{recipient.address}</span></> : ' · no address'}
      </span>
    </span>
  );
}

export const messageColumns = helper.columns([
  helper.accessor('sendAt', { header: 'Send time', cell: (info) => <SendTime message={info.row.original} /> }),
  helper.accessor('recipient', { header: 'Recipient', enableSorting: false, cell: (info) => <Recipient recipient={info.getValue()} /> }),
  helper.accessor('channel', { header: 'Channel', enableSorting: false, cell: (info) => channelText(info.getValue()) }),
  helper.accessor('template', { header: 'Message type', enableSorting: false, cell: (info) => MESSAGE_TEMPLATE_LABELS[info.getValue()] }),
  helper.accessor('status', { header: 'Status', cell: (info) => <MessageStatusCell message={info.row.original} /> }),
  // Attempts and the provider's id share a column, so the baby and "Send again" stay on screen at desk width.
  helper.accessor('attempts', {
    header: 'Delivery',
    enableSorting: false,
    cell: (info) => {
      const { attempts, providerId } = info.row.original;
      return (
        <span className="flex flex-col">
          <span className="tabular-nums">{attempts === 1 ? '1 attempt' : `${attempts} attempts`}</span>
          {providerId && <span className="max-w-32 truncate font-mono text-xs text-ink-700" title={providerId}>{providerId}</span>}
        </span>
      );
    },
  }),
  helper.accessor('infant', {
    header: 'Baby',
    enableSorting: false,
    cell: (info) => {
      const infant = info.getValue();
      if (!infant) return '—';
      return (
        <Link to={`/infants/${infant.id}`} className="font-semibold text-brand-700 underline underline-offset-2">
          {infant.name}
        </Link>
      );
    },
  }),
  helper.display({ id: 'actions', header: 'Actions', enableSorting: false, cell: ({ row }) => <RetryMessageAction message={row.original} /> }),
]);

export const messageSort = urlSort<ListMessagesQuery['sort']>(MESSAGE_SORTS, ['sendAt', 'status']);
