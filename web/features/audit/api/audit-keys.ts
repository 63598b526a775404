export interface ReadFilters {
  actorId?: string;
  from?: string;
  to?: string;
}

export const auditKeys = {
  all: ['audit'] as const,
  reads: (infantId: string, filters: ReadFilters) => [...auditKeys.all, 'reads', infantId, filters] as const,
  chainChecks: () => [...auditKeys.all, 'chain-checks'] as const,
  /** The programme's people, to filter the reads by. */
  people: () => [...auditKeys.all, 'people'] as const,
};
