import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { listMessagesQuerySchema, type ListMessagesQuery } from '../../../../shared/schemas/messages';
import { readParam } from '../../../lib/url-param';

const shape = listMessagesQuerySchema.shape;
const DEFAULTS = listMessagesQuerySchema.parse({});

export function readMessageLogView(params: URLSearchParams): ListMessagesQuery {
  return {
    page: readParam(shape.page, params.get('page'), DEFAULTS.page),
    pageSize: readParam(shape.pageSize, params.get('pageSize'), DEFAULTS.pageSize),
    sort: readParam(shape.sort, params.get('sort'), DEFAULTS.sort),
    status: readParam(shape.status, params.get('status'), undefined),
    channel: readParam(shape.channel, params.get('channel'), undefined),
    template: readParam(shape.template, params.get('template'), undefined),
    infantId: readParam(shape.infantId, params.get('infantId'), undefined),
  };
}

export function writeMessageLogView(query: ListMessagesQuery): URLSearchParams {
  const params = new URLSearchParams();
  if (query.page !== DEFAULTS.page) params.set('page', String(query.page));
  if (query.pageSize !== DEFAULTS.pageSize) params.set('pageSize', String(query.pageSize));
  if (query.sort !== DEFAULTS.sort) params.set('sort', query.sort);
  if (query.status) params.set('status', query.status);
  if (query.channel) params.set('channel', query.channel);
  if (query.template) params.set('template', query.template);
  if (query.infantId) params.set('infantId', query.infantId);
  return params;
}

/** The message log view lives in the address bar, so reload, back and a shared link all restore it. */
export function useMessageLogView() {
  const [params, setParams] = useSearchParams();
  const query = useMemo(() => readMessageLogView(params), [params]);
  const update = useCallback(
    (patch: Partial<ListMessagesQuery>) => setParams(writeMessageLogView({ ...query, ...patch })),
    [query, setParams],
  );
  return { query, update };
}
