import type { Role } from '@rhotrace/api-types';
import { PERMISSIONS } from '../auth/permissions';

/** One entry of the side navigation. */
export interface NavItem {
  path: string;
  label: string;
  hint: string;
  roles: readonly Role[];
  exact?: boolean;
}

const EVERYONE = PERMISSIONS.upload;

/** The navigation, in order; each role sees only the entries it may use. */
export const NAV_ITEMS: readonly NavItem[] = [
  { path: '/', label: 'Bench', hint: 'Your work today', roles: EVERYONE, exact: true },
  {
    path: '/lots',
    label: 'Lots & wafers',
    hint: 'Registered material',
    roles: PERMISSIONS.seeAllLots,
  },
  { path: '/overlay', label: 'Overlay', hint: 'Curves side by side', roles: PERMISSIONS.analyse },
  { path: '/worklist', label: 'Worklist', hint: 'Who measures what', roles: PERMISSIONS.assign },
  {
    path: '/stations',
    label: 'Probe stations',
    hint: 'Benches and sensors',
    roles: PERMISSIONS.seeAllLots,
  },
  { path: '/people', label: 'People', hint: 'Accounts and roles', roles: PERMISSIONS.manageUsers },
  { path: '/trail', label: 'Change trail', hint: 'Who changed what', roles: PERMISSIONS.readAudit },
];

/** The navigation entries a role may see. */
export function navFor(role: Role | null): NavItem[] {
  return role === null ? [] : NAV_ITEMS.filter((item) => item.roles.includes(role));
}
