export const readingKeys = {
  all: ['readings'] as const,
  lists: () => [...readingKeys.all, 'list'] as const,
  list: (infantId: string) => [...readingKeys.lists(), infantId] as const,
  details: () => [...readingKeys.all, 'detail'] as const,
  detail: (infantId: string, readingId: string) => [...readingKeys.details(), infantId, readingId] as const,
};
