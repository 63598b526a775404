export const journeyKeys = {
  all: ['journeys'] as const,
  lists: () => [...journeyKeys.all, 'list'] as const,
  list: (infantId: string) => [...journeyKeys.lists(), infantId] as const,
  waiting: () => [...journeyKeys.all, 'waiting'] as const,
  details: () => [...journeyKeys.all, 'detail'] as const,
  detail: (id: string) => [...journeyKeys.details(), id] as const,
};
