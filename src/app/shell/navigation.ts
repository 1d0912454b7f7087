import { ROLES, type Role } from '@shared/api';

/** One entry of the side navigation, and who may open its page. */
export interface NavItem {
  /** Stable name, also used for the link's `data-testid` (`nav-<id>`). */
  readonly id: string;
  /** Words on the link. */
  readonly label: string;
  /** Material Symbols name. */
  readonly icon: string;
  /** Router path of the page, from the app's root. */
  readonly path: string;
  /** Roles that see the link and may open the page. */
  readonly roles: readonly Role[];
}

/** The side navigation, in order. A later feature adds its page here and guards its route with its roles. */
export const NAV_ITEMS = [
  { id: 'overview', label: 'Overview', icon: 'space_dashboard', path: '/', roles: ROLES },
  { id: 'runs', label: 'Runs', icon: 'table_rows', path: '/runs', roles: ROLES },
  { id: 'upload', label: 'Upload', icon: 'upload_file', path: '/upload', roles: ['experimentalist'] },
  { id: 'planner', label: 'Planner', icon: 'calculate', path: '/planner', roles: ['experimentalist', 'shift-lead', 'admin'] },
  { id: 'setups', label: 'Setups', icon: 'settings_input_component', path: '/setups', roles: ROLES },
  { id: 'profiles', label: 'Profiles', icon: 'tune', path: '/profiles', roles: ROLES },
  { id: 'audit', label: 'Audit', icon: 'policy', path: '/audit', roles: ['auditor', 'admin'] },
  { id: 'users', label: 'Users', icon: 'group', path: '/users', roles: ['admin'] },
  { id: 'workers', label: 'Workers', icon: 'memory', path: '/workers', roles: ['admin'] },
] as const satisfies readonly NavItem[];

/** Name of one of {@link NAV_ITEMS}. */
export type NavItemId = (typeof NAV_ITEMS)[number]['id'];

/** The entry named `id`. */
export function navItem(id: NavItemId): NavItem {
  return NAV_ITEMS.find((item) => item.id === id)!;
}

/** The entries a user with `roles` may see. */
export function navItemsFor(roles: readonly Role[]): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.some((role) => roles.includes(role)));
}
