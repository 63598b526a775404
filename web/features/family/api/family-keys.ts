export const familyKeys = {
  all: ['family'] as const,
  babies: () => [...familyKeys.all, 'babies'] as const,
  plan: (infantId: string) => [...familyKeys.all, 'plan', infantId] as const,
};
