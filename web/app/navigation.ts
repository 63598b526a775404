import type { AppAbility } from '@shared/auth/ability';
import { isStaffRole, type Role } from '@shared/auth/roles';

export type NavIcon = 'home' | 'people' | 'settings' | 'list' | 'add' | 'day' | 'check' | 'plan';

export interface NavItem {
  to: string;
  label: string;
  icon: NavIcon;
  /** The same CASL rules the API enforces decide whether the item is offered. */
  allowed: (ability: AppAbility) => boolean;
}

const caseload: NavItem = { to: '/caseload', label: 'Caseload', icon: 'list', allowed: (a) => a.can('read', 'Infant') };
const messageLog: NavItem = { to: '/messages', label: 'Messages', icon: 'list', allowed: (a) => a.can('read', 'Message') };

/**
 * Whose work each page is, in menu order; the first item is the role's home.
 * Route access is checked against this table too, so a menu and a guard can never disagree.
 */
export const NAV_BY_ROLE: Record<Role, readonly NavItem[]> = {
  admin: [
    { to: '/admin', label: 'Overview', icon: 'home', allowed: (a) => a.can('read', 'Programme') },
    { to: '/admin/people', label: 'People', icon: 'people', allowed: (a) => a.can('create', 'User') },
    { to: '/admin/settings', label: 'Programme settings', icon: 'settings', allowed: (a) => a.can('update', 'Policy') },
    messageLog,
  ],
  coordinator: [
    { to: '/coordinator', label: 'Overview', icon: 'home', allowed: (a) => a.can('read', 'Programme') },
    caseload,
    { to: '/enrol', label: 'Enrol a baby', icon: 'add', allowed: (a) => a.can('create', 'Infant') },
    messageLog,
    { to: '/equipment-orders', label: 'Equipment orders', icon: 'list', allowed: (a) => a.can('create', 'EquipmentOrder') },
  ],
  nurse: [{ to: '/nurse', label: 'My day', icon: 'day', allowed: (a) => a.can('update', 'Visit') }, caseload],
  consultant: [
    { to: '/consultant', label: 'Overview', icon: 'home', allowed: (a) => a.can('read', 'Programme') },
    { to: '/sign-off', label: 'Sign-off queue', icon: 'check', allowed: (a) => a.can('approve', 'Prescription') },
    caseload,
  ],
  family: [{ to: '/family', label: 'Our plan', icon: 'plan', allowed: (a) => a.can('read', 'Infant') }],
};

export const homePathFor = (role: Role): string => NAV_BY_ROLE[role][0].to;

export function navItemsFor(role: Role, ability: AppAbility): NavItem[] {
  return NAV_BY_ROLE[role].filter((item) => item.allowed(ability));
}

const covers = (item: NavItem, path: string) => path === item.to || path.startsWith(`${item.to}/`);

/** Pages reached from a list or a link rather than the menu, with the same kind of rule as the menu items. */
const LINKED_PAGES: readonly { prefix: string; allowed: (role: Role, ability: AppAbility) => boolean }[] = [
  // A baby's full record is staff work; a family sees its own plan on the family page instead.
  { prefix: '/infants/', allowed: (role, a) => isStaffRole(role) && a.can('read', 'Infant') },
  { prefix: '/recordings/', allowed: (role, a) => isStaffRole(role) && a.can('read', 'Recording') },
  // A family sees its approved trips on the family page; the check with its working is staff work.
  { prefix: '/journeys/', allowed: (role, a) => isStaffRole(role) && a.can('read', 'Journey') },
  // The programme's orders to the supplier: the coordinator's and admin's list, reached from the overview.
  { prefix: '/equipment-orders', allowed: (role, a) => (role === 'coordinator' || role === 'admin') && a.can('read', 'EquipmentOrder') },
];

export function canVisit(path: string, role: Role, ability: AppAbility): boolean {
  return (
    navItemsFor(role, ability).some((item) => covers(item, path)) ||
    LINKED_PAGES.some((page) => path.startsWith(page.prefix) && page.allowed(role, ability))
  );
}

/** Where to land after sign-in: the requested page if it is this role's, otherwise the role's home. */
export function landingPathFor(role: Role, ability: AppAbility, requested: string | null): string {
  // Only same-site paths: a crafted link must not send a fresh sign-in to another origin.
  const safe = requested && requested.startsWith('/') && !requested.startsWith('//') ? requested : null;
  if (safe && canVisit(new URL(safe, 'http://nestflow.invalid').pathname, role, ability)) return safe;
  return homePathFor(role);
}
