import type { ListMessagesQuery } from '@shared/schemas/messages';

export const messageKeys = {
  all: ['messages'] as const,
  lists: () => [...messageKeys.all, 'list'] as const,
  list: (query: ListMessagesQuery) => [...messageKeys.lists(), query] as const,
};
