import { EmailText } from '../../../components/ui/email-text';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { MESSAGE_SORTS, MESSAGE_TEMPLATE_LABELS, type ListMessagesQuery, type Message } from '@shared/schemas/messages';
import { urlSort } from '../../../components/ui/data-table/url-sort';
import type { ServerTableFeatures } from '../../../components/ui/data-table/use-server-table';
import { usePhoneText } from '../../../lib/phone-text';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { channelText, formatProgrammeTime } from './message-format';
import { MessageStatusCell } from './message-status';
import { RetryMessageAction } from './retry-message-action';

const helper = createColumnHelper<ServerTableFeatures, Message>();

function SendTime({ message }: { message: Message }) {
  const { programmeTimeZone } = useSignedInUser();
  const sentLater = message.sentAt && message.sentAt.slice(0, 16) !== message.sendAt.slice(0, 16);
  return (
    <span className="flex flex-col">
      <span className="whitespace-nowrap">{formatProgrammeTime(message.sendAt, programmeTimeZone)}</span>
      {sentLater && <span className="text-sm whitespace-nowrap text-ink-700">Sent {formatProgrammeTime(message.sentAt!, programmeTimeZone)}</span>}
    </span>
  );
}

/** What the message is and which baby it is about: the link to the baby stays in view at desk width. */
function WhatAbout({ message }: { message: Message }) {
  return (
    <span className="flex flex-col">
      <span>{MESSAGE_TEMPLATE_LABELS[message.template]}</span>
      {message.infant && (
        <Link to={`/infants/${message.infant.id}`} className="font-semibold break-words text-brand-700 underline underline-offset-2">
          {message.infant.name}
        </Link>
      )}
    </span>
  );
}

function Recipient({ message }: { message: Message }) {
  const phoneText = usePhoneText();
  const { recipient, channel, status } = message;
  const address = recipient.address && channel === 'sms' ? phoneText(recipient.address) : recipient.address;
  // A family message still waiting goes by the channel and address the family prefers when it is sent.
  const how = channel ? (status === 'scheduled' && recipient.kind === 'family' ? `${channelText(channel)} for now` : channelText(channel)) : null;
  return (
    <span className="flex flex-col">
      <span className="font-semibold break-words">{recipient.name}</span>
      <span className="text-sm text-ink-700">
        {[recipient.kind === 'family' ? 'Family' : 'Staff', how].filter(Boolean).join(' · ')}
      </span>
      {/* An e-mail address wraps only before the "@" and the domain's dots; a phone number never inside its groups. */}
      {address && channel === 'email' ? <EmailText address={address} className="text-sm text-ink-700" /> : <span className="text-sm break-words text-ink-700">{address ?? 'No address'}</span>}
    </span>
  );
}

function Outcome({ message }: { message: Message }) {
  const { attempts, providerId } = message;
  return (
    <span className="flex flex-col gap-1">
      <MessageStatusCell message={message} />
      <span className="text-sm text-ink-700 tabular-nums">{attempts === 1 ? '1 attempt' : `${attempts} attempts`}</span>
      {providerId && <span className="max-w-40 truncate font-mono text-xs text-ink-700" title={providerId}>{providerId}</span>}
    </span>
  );
}

// Five columns, each holding a few lines, so the table fits a 1366 px screen with the menu beside it and the baby
// and "Send again" never scroll out of sight.
export const messageColumns = helper.columns([
  helper.accessor('sendAt', { header: 'Send time', cell: (info) => <SendTime message={info.row.original} /> }),
  helper.accessor('template', { header: 'Message and baby', enableSorting: false, cell: (info) => <WhatAbout message={info.row.original} /> }),
  helper.accessor('recipient', { header: 'Recipient', enableSorting: false, cell: (info) => <Recipient message={info.row.original} /> }),
  helper.accessor('status', { header: 'Status', cell: (info) => <Outcome message={info.row.original} /> }),
  helper.display({ id: 'actions', header: 'Actions', enableSorting: false, cell: ({ row }) => <RetryMessageAction message={row.original} /> }),
]);

export const messageSort = urlSort<ListMessagesQuery['sort']>(MESSAGE_SORTS, ['sendAt', 'status']);
