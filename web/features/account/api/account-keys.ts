export const accountKeys = {
  all: ['account'] as const,
  setupLinks: () => [...accountKeys.all, 'setup-link'] as const,
  setupLink: (token: string) => [...accountKeys.setupLinks(), token] as const,
};
