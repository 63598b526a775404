export const overviewKeys = {
  all: ['overview'] as const,
  mine: () => [...overviewKeys.all, 'mine'] as const,
};
