import type { ListInfantsQuery } from '@shared/schemas/infants';

export const infantKeys = {
  all: ['infants'] as const,
  lists: () => [...infantKeys.all, 'list'] as const,
  list: (query: ListInfantsQuery) => [...infantKeys.lists(), query] as const,
  details: () => [...infantKeys.all, 'detail'] as const,
  detail: (id: string) => [...infantKeys.details(), id] as const,
  prescriptions: (id: string) => [...infantKeys.detail(id), 'prescriptions'] as const,
  audit: (id: string) => [...infantKeys.detail(id), 'audit'] as const,
  /** The trail as of one state of the versions: a new or decided version opens a fresh read of the trail. */
  auditAt: (id: string, versionsState: string) => [...infantKeys.audit(id), versionsState] as const,
};

/** Programme reference data the enrolment and record forms need: sites, policy, staff to choose from. */
export const programmeKeys = {
  all: ['programme'] as const,
  sites: () => [...programmeKeys.all, 'sites'] as const,
  policy: () => [...programmeKeys.all, 'policy'] as const,
  staff: (role: 'nurse' | 'consultant') => [...programmeKeys.all, 'staff', role] as const,
};
