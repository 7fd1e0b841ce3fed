import { ROLES, type Role } from './auth';

/**
 * Everything a role may be allowed to do. Visibility of records is a capability too: a role
 * without `records:see-all` (the technician, shared by students) sees only the wafers assigned to
 * it, and the lots, sweeps and fits that hang from them.
 */
export const CAPABILITIES = [
  'users:manage',
  'records:edit',
  'stations:edit',
  'assignments:assign',
  'assignments:see-all',
  'sweeps:upload',
  'records:see-all',
  'fits:run',
  'sweeps:delete-any',
  'sweeps:delete-own',
  'fits:delete-any',
  'fits:delete-own',
  'audit:read',
  'plans:make',
] as const;

/** One thing a role may be allowed to do. */
export type Capability = (typeof CAPABILITIES)[number];

/**
 * The role-to-capability table: the only place that says what each role may do. The API's
 * route guards and access checks and the web's guards and navigation all read it.
 *
 * - `records:edit`: create and edit lots, wafers and their specs.
 * - `sweeps:upload`: upload sweeps to every wafer the role sees (technicians: assigned ones).
 * - `fits:run`: run and save fits, edit model parameters.
 * - `*:delete-any` / `*:delete-own`: soft-delete any record, or only those the user created.
 * - `plans:make`: compute measurement plans (probe current, temperature steps); anyone who
 *   assigns attaches them, and the assignee reads the one attached to their assignment.
 */
export const ROLE_CAPABILITIES: Readonly<Record<Role, readonly Capability[]>> = {
  admin: [
    'users:manage',
    'records:edit',
    'stations:edit',
    'assignments:assign',
    'assignments:see-all',
    'sweeps:upload',
    'records:see-all',
    'fits:run',
    'sweeps:delete-any',
    'fits:delete-any',
    'audit:read',
    'plans:make',
  ],
  manager: [
    'records:edit',
    'stations:edit',
    'assignments:assign',
    'assignments:see-all',
    'sweeps:upload',
    'records:see-all',
    'fits:run',
    'sweeps:delete-any',
    'fits:delete-any',
    'audit:read',
    'plans:make',
  ],
  engineer: [
    'records:edit',
    'stations:edit',
    'assignments:see-all',
    'sweeps:upload',
    'records:see-all',
    'fits:run',
    'sweeps:delete-own',
    'fits:delete-own',
    'plans:make',
  ],
  physicist: [
    'assignments:see-all',
    'sweeps:upload',
    'records:see-all',
    'fits:run',
    'sweeps:delete-own',
    'fits:delete-own',
    'plans:make',
  ],
  technician: ['sweeps:upload'],
};

/**
 * True when `role` has `capability` in {@link ROLE_CAPABILITIES}; false for no role (signed out).
 *
 * Example: `roleCan('physicist', 'fits:run')` is true, `roleCan('technician', 'fits:run')` false.
 */
export function roleCan(role: Role | null | undefined, capability: Capability): boolean {
  return role != null && ROLE_CAPABILITIES[role].includes(capability);
}

/**
 * The roles that have `capability`, in the order of `ROLES` (most privileged first).
 *
 * Example: `rolesWith('audit:read')` is `['admin', 'manager']`.
 */
export function rolesWith(capability: Capability): Role[] {
  return ROLES.filter((role) => roleCan(role, capability));
}
