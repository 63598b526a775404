export const myDayKeys = {
  all: ['my-day'] as const,
  today: () => [...myDayKeys.all, 'today'] as const,
};
