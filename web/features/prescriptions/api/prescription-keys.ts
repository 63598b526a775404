export const prescriptionKeys = {
  all: ['prescriptions'] as const,
  queue: () => [...prescriptionKeys.all, 'queue'] as const,
  details: () => [...prescriptionKeys.all, 'detail'] as const,
  detail: (id: string) => [...prescriptionKeys.details(), id] as const,
  // Outside `all`: a decision does not change the programme's flowmeter steps.
  policy: () => ['policy', 'current'] as const,
};
