export const familyKeys = {
  all: ['family'] as const,
  babies: () => [...familyKeys.all, 'babies'] as const,
  plan: (infantId: string) => [...familyKeys.all, 'plan', infantId] as const,
  // Under 'policy', so a newly saved policy version refreshes the numbers a family sees.
};
