import { roleCan, type Capability, type Role } from '@rhotrace/api-types';

/** One entry of the side navigation. */
export interface NavItem {
  path: string;
  label: string;
  hint: string;
  /** The capability the entry needs; absent for entries every signed-in role uses. */
  capability?: Capability;
  exact?: boolean;
}

/** The navigation, in order; each role sees only the entries it may use. */
export const NAV_ITEMS: readonly NavItem[] = [
  { path: '/', label: 'Bench', hint: 'Your work today', exact: true },
  {
    path: '/lots',
    label: 'Lots & wafers',
    hint: 'Registered material',
    capability: 'records:see-all',
  },
  { path: '/overlay', label: 'Overlay', hint: 'Curves side by side', capability: 'fits:run' },
  {
    path: '/worklist',
    label: 'Worklist',
    hint: 'Who measures what',
    capability: 'assignments:assign',
  },
  {
    path: '/stations',
    label: 'Probe stations',
    hint: 'Benches and sensors',
    capability: 'records:see-all',
  },
  { path: '/people', label: 'People', hint: 'Accounts and roles', capability: 'users:manage' },
  { path: '/trail', label: 'Change trail', hint: 'Who changed what', capability: 'audit:read' },
];

/** The navigation entries a role may see (none when signed out). */
export function navFor(role: Role | null): NavItem[] {
  if (role === null) return [];
  return NAV_ITEMS.filter((item) => !item.capability || roleCan(role, item.capability));
}
