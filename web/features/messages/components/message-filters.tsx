import { useCallback } from 'react';
import {
  CHANNELS,
  MESSAGE_STATUSES,
  MESSAGE_TEMPLATES,
  MESSAGE_TEMPLATE_LABELS,
  type ListMessagesQuery,
} from '@shared/schemas/messages';
import { Button } from '../../../components/ui/button';
import { SelectFilter } from '../../../components/ui/data-table/select-filter';
import { CHANNEL_LABELS, MESSAGE_STATUS_LABELS } from './message-format';
import { MessageSearch } from './message-search';

interface MessageFiltersProps {
  query: ListMessagesQuery;
  update: (patch: Partial<ListMessagesQuery>, opts?: { replace?: boolean }) => void;
}

export function MessageFilters({ query, update }: MessageFiltersProps) {
  const onSearch = useCallback((q: string | undefined, typing: boolean) => update({ q, page: 1 }, { replace: typing }), [update]);
  return (
    <div className="flex flex-col gap-3">
      <MessageSearch value={query.q} onSearch={onSearch} />
      <div className="flex flex-wrap items-end gap-3">
        <SelectFilter label="Status" value={query.status} options={MESSAGE_STATUSES} labels={MESSAGE_STATUS_LABELS}
          anyLabel="Any status" onChange={(status) => update({ status, page: 1 })} />
        <SelectFilter label="Channel" value={query.channel} options={CHANNELS} labels={CHANNEL_LABELS}
          anyLabel="Any channel" onChange={(channel) => update({ channel, page: 1 })} />
        <SelectFilter label="Message type" value={query.template} options={MESSAGE_TEMPLATES} labels={MESSAGE_TEMPLATE_LABELS}
          anyLabel="Any type" onChange={(template) => update({ template, page: 1 })} />
      </div>
      {/* A link from a baby's record narrows the log to that baby; say so, or an empty list would mislead. */}
      {query.infantId && (
        <p className="flex flex-wrap items-center gap-2 text-ink-700">
          Showing messages about one baby only.
          <Button size="sm" variant="quiet" onClick={() => update({ infantId: undefined, page: 1 })}>Show every baby</Button>
        </p>
      )}
    </div>
  );
}
