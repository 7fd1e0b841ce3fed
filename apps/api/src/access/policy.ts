/**
 * Who may change what, as plain checks over the role-to-capability table in
 * `@rhotrace/api-types` (which record a user may see is in `visibility.service.ts`). Route
 * guards use `requireCapability`; services call these when the answer depends on the record.
 */
import { roleCan, type Capability, type SessionUser } from '@rhotrace/api-types';
import { forbidden } from '../errors';

/** True when the user's role has `capability`. */
export function can(user: SessionUser, capability: Capability): boolean {
  return roleCan(user.role, capability);
}

/** Throws 403 unless the user's role has `capability`. */
export function assertCan(user: SessionUser, capability: Capability, message?: string): void {
  if (!can(user, capability)) throw forbidden(message);
}

/** Why a user may not delete a record, or null when they may. */
type DeleteDenial = 'role' | 'not-own' | null;

function deleteDenial(
  user: SessionUser,
  createdById: number,
  any: Capability,
  own: Capability,
): DeleteDenial {
  if (can(user, any)) return null;
  if (!can(user, own)) return 'role';
  return createdById === user.id ? null : 'not-own';
}

/**
 * True when the user may soft-delete the sweep: any sweep with `sweeps:delete-any` (admins,
 * managers), only their own uploads with `sweeps:delete-own` (engineers, physicists).
 */
export function mayDeleteSweep(user: SessionUser, sweep: { uploadedById: number }): boolean {
  return deleteDenial(user, sweep.uploadedById, 'sweeps:delete-any', 'sweeps:delete-own') === null;
}

/** Throws 403, saying why, unless `mayDeleteSweep`. */
export function assertMayDeleteSweep(user: SessionUser, sweep: { uploadedById: number }): void {
  const denial = deleteDenial(user, sweep.uploadedById, 'sweeps:delete-any', 'sweeps:delete-own');
  if (denial === 'role') throw forbidden('Technicians may not delete sweeps');
  if (denial === 'not-own') throw forbidden('You may delete only sweeps you uploaded');
}

/** True when the user may soft-delete the fit: the same rule as sweeps, for fits they saved. */
export function mayDeleteFit(user: SessionUser, fit: { createdById: number }): boolean {
  return deleteDenial(user, fit.createdById, 'fits:delete-any', 'fits:delete-own') === null;
}

/** Throws 403, saying why, unless `mayDeleteFit`. */
export function assertMayDeleteFit(user: SessionUser, fit: { createdById: number }): void {
  const denial = deleteDenial(user, fit.createdById, 'fits:delete-any', 'fits:delete-own');
  if (denial === 'role') throw forbidden('Your role may not delete fits');
  if (denial === 'not-own') throw forbidden('You may delete only fits you saved');
}

/** True when the user sees every assignment, not only those assigned to them. */
export function seesAllAssignments(user: SessionUser): boolean {
  return can(user, 'assignments:see-all');
}
