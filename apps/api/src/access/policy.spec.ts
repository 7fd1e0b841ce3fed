import { ROLES, rolesWith, type Role, type SessionUser } from '@rhotrace/api-types';
import { describe, expect, it } from 'vitest';
import { HttpError } from '../errors';
import { assertMayDeleteFit, assertMayDeleteSweep, mayDeleteFit, mayDeleteSweep } from './policy';

const userOf = (role: Role, id = 7): SessionUser => ({
  id,
  role,
  email: `${role}@lab.example`,
  name: role,
});

describe('the role-to-capability table', () => {
  it('gives each capability to the roles of the product table', () => {
    expect(rolesWith('users:manage')).toEqual(['admin']);
    expect(rolesWith('records:edit')).toEqual(['admin', 'manager', 'engineer']);
    expect(rolesWith('stations:edit')).toEqual(['admin', 'manager', 'engineer']);
    expect(rolesWith('assignments:assign')).toEqual(['admin', 'manager']);
    expect(rolesWith('sweeps:upload')).toEqual([...ROLES]);
    expect(rolesWith('records:see-all')).toEqual(['admin', 'manager', 'engineer', 'physicist']);
    expect(rolesWith('fits:run')).toEqual(['admin', 'manager', 'engineer', 'physicist']);
    expect(rolesWith('audit:read')).toEqual(['admin', 'manager']);
    expect(rolesWith('plans:make')).toEqual(['admin', 'manager', 'engineer', 'physicist']);
  });
});

describe('who may delete a sweep or a fit', () => {
  // [role, deletes own, deletes another's]
  const table: Array<[Role, boolean, boolean]> = [
    ['admin', true, true],
    ['manager', true, true],
    ['engineer', true, false],
    ['physicist', true, false],
    ['technician', false, false],
  ];

  it.each(table)('%s: own %s, another’s %s', (role, own, others) => {
    const user = userOf(role);
    expect(mayDeleteSweep(user, { uploadedById: user.id })).toBe(own);
    expect(mayDeleteSweep(user, { uploadedById: user.id + 1 })).toBe(others);
    expect(mayDeleteFit(user, { createdById: user.id })).toBe(own);
    expect(mayDeleteFit(user, { createdById: user.id + 1 })).toBe(others);
  });

  it('says why in the 403', () => {
    const refusal = (check: () => void) => {
      try {
        check();
      } catch (error) {
        return error instanceof HttpError ? `${error.code}: ${error.message}` : String(error);
      }
      return null;
    };
    const technician = userOf('technician');
    const engineer = userOf('engineer');
    expect(refusal(() => assertMayDeleteSweep(technician, { uploadedById: technician.id }))).toBe(
      'forbidden: Technicians may not delete sweeps',
    );
    expect(refusal(() => assertMayDeleteSweep(engineer, { uploadedById: 99 }))).toBe(
      'forbidden: You may delete only sweeps you uploaded',
    );
    expect(refusal(() => assertMayDeleteFit(technician, { createdById: technician.id }))).toBe(
      'forbidden: Your role may not delete fits',
    );
    expect(refusal(() => assertMayDeleteFit(engineer, { createdById: 99 }))).toBe(
      'forbidden: You may delete only fits you saved',
    );
    expect(refusal(() => assertMayDeleteSweep(engineer, { uploadedById: engineer.id }))).toBe(null);
  });
});
