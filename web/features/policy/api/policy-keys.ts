// Under 'policy', so a saved version also refreshes any other screen that keeps the policy under that prefix.
export const policyKeys = {
  all: ['policy'] as const,
  settings: () => [...policyKeys.all, 'settings'] as const,
  history: () => [...policyKeys.all, 'history'] as const,
};
