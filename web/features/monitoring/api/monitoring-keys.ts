export const monitoringKeys = {
  all: ['monitoring'] as const,
  infant: (infantId: string) => [...monitoringKeys.all, 'infant', infantId] as const,
  readings: (infantId: string) => [...monitoringKeys.infant(infantId), 'readings'] as const,
  schedule: (infantId: string) => [...monitoringKeys.infant(infantId), 'schedule'] as const,
  // Under 'policy', so saving a new policy version refreshes the targets shown here as well.
  targets: () => ['policy', 'overnight-targets'] as const,
};
