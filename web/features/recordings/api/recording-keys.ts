export const recordingKeys = {
  all: ['recordings'] as const,
  lists: () => [...recordingKeys.all, 'list'] as const,
  infantLists: (infantId: string) => [...recordingKeys.lists(), infantId] as const,
  list: (infantId: string, page: number, pageSize: number) => [...recordingKeys.infantLists(infantId), { page, pageSize }] as const,
  details: () => [...recordingKeys.all, 'detail'] as const,
  detail: (id: string) => [...recordingKeys.details(), id] as const,
  trace: (id: string) => [...recordingKeys.detail(id), 'trace'] as const,
  savedMapping: (infantId: string, found: readonly string[]) => [...recordingKeys.all, 'saved-mapping', infantId, [...found]] as const,
};
