export const orderKeys = {
  all: ['equipment-orders'] as const,
  lists: () => [...orderKeys.all, 'list'] as const,
  forInfant: (infantId: string) => [...orderKeys.lists(), 'infant', infantId] as const,
  programme: (status: string) => [...orderKeys.lists(), 'programme', status] as const,
  supplier: (token: string) => [...orderKeys.all, 'supplier', token] as const,
};
