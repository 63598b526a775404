export const preferenceKeys = {
  all: ['preferences'] as const,
  mine: () => [...preferenceKeys.all, 'mine'] as const,
};
