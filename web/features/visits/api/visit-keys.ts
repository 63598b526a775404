export type StaffRole = 'nurse' | 'coordinator' | 'consultant';

export const visitKeys = {
  all: ['visits'] as const,
  lists: () => [...visitKeys.all, 'list'] as const,
  list: (infantId: string) => [...visitKeys.lists(), infantId] as const,
  staff: (role: StaffRole) => [...visitKeys.all, 'staff', role] as const,
};
