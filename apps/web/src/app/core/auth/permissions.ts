import type { Role } from '@rhotrace/api-types';

/** Who may do what in the app (the API enforces the same rules; this only shapes the screens). */
export const PERMISSIONS = {
  editRecords: ['admin', 'manager', 'engineer'],
  editStations: ['admin', 'manager', 'engineer'],
  assign: ['admin', 'manager'],
  upload: ['admin', 'manager', 'engineer', 'physicist', 'technician'],
  analyse: ['admin', 'manager', 'engineer', 'physicist'],
  readAudit: ['admin', 'manager'],
  manageUsers: ['admin'],
  seeAllLots: ['admin', 'manager', 'engineer', 'physicist'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;
