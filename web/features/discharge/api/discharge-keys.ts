export const dischargeKeys = {
  all: ['discharge'] as const,
  detail: (infantId: string) => [...dischargeKeys.all, infantId] as const,
};
