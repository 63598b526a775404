export const ROLES = ['admin', 'coordinator', 'nurse', 'consultant', 'family'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Programme admin',
  coordinator: 'Discharge coordinator',
  nurse: 'Home-care nurse',
  consultant: 'Consultant',
  family: 'Family',
};

export const STAFF_ROLES: readonly Role[] = ['admin', 'coordinator', 'nurse', 'consultant'];
export const isStaffRole = (role: Role): boolean => STAFF_ROLES.includes(role);
