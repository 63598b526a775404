import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { messagesPageSchema, type ListMessagesQuery } from '@shared/schemas/messages';
import { api } from '../../../lib/api-client';
import { messageKeys } from './message-keys';

export const messagesQueryOptions = (query: ListMessagesQuery) =>
  queryOptions({
    queryKey: messageKeys.list(query),
    queryFn: ({ signal }) => api.get('/api/messages', messagesPageSchema, { ...query }, signal),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useMessages = (query: ListMessagesQuery) => useQuery(messagesQueryOptions(query));
