import { listMessagesQuerySchema } from '@shared/schemas/messages';
import { Alert } from '../../../components/ui/alert';
import { CursorPager } from '../../../components/ui/data-table/cursor-pager';
import { DownloadLink } from '../../../components/ui/download-link';
import { exportHref } from '../../../lib/export-href';
import { TableFrame } from '../../../components/ui/data-table/table-frame';
import { useServerTable } from '../../../components/ui/data-table/use-server-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useMessages } from '../api/get-messages';
import { useMessageLogView } from '../hooks/use-message-log-view';
import { messageColumns, messageSort } from './message-columns';
import { MessageFilters } from './message-filters';

/** Every message the programme planned or sent, newest first unless the URL says otherwise. */
export function MessageTable() {
  const { query, update } = useMessageLogView();
  const messages = useMessages(query);
  const table = useServerTable({ columns: messageColumns, result: messages.data, view: query, update, sort: messageSort });

  const filtered = Boolean(query.status || query.channel || query.template || query.infantId || query.q);
  return (
    <div className="flex flex-col gap-4">
      <MessageFilters query={query} update={update} />
      <div className="flex justify-end">
        <DownloadLink href={exportHref('/api/messages.csv', listMessagesQuerySchema, query)} />
      </div>
      {messages.isPending ? (
        <Spinner label="Loading the messages" />
      ) : messages.isError ? (
        <Alert>{errorMessage(messages.error)}</Alert>
      ) : (
        <>
          <p className="text-sm text-ink-500 md:hidden">Swipe the table sideways to see every column.</p>
          <TableFrame table={table} caption={`Messages, ${messages.data.totalIsEstimate ? 'about ' : ''}${messages.data.total} in all`} minWidth="min-w-[50rem]"
            busy={messages.isPlaceholderData} compact />
          {messages.data.items.length === 0 && (
            <EmptyState message={filtered ? 'No message matches this search and these filters.' : 'No messages yet: reminders show here as soon as they are planned.'} />
          )}
          <CursorPager view={query} result={messages.data} noun={{ one: 'message', other: 'messages' }} onChange={update} />
        </>
      )}
    </div>
  );
}
