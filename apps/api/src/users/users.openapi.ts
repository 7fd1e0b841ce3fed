import type { AssigneeDto, UserDto } from '@rhotrace/api-types';
import { ROLES } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registry, routesOf } from '../openapi/registry';
import { itemsOf, pageOf, timestamps } from '../openapi/shapes';
import { assigneesQuery, createBody, listQuery, updateBody } from './users.schemas';

const userSchema = registry.register(
  'User',
  z
    .object({
      id: z.number().int(),
      email: z.string(),
      name: z.string(),
      role: z.enum(ROLES),
      active: z.boolean(),
      ...timestamps,
    })
    .strict(),
) satisfies z.ZodType<UserDto>;

const assigneeSchema = z
  .object({ id: z.number().int(), name: z.string(), email: z.string(), role: z.enum(ROLES) })
  .strict() satisfies z.ZodType<AssigneeDto>;

/** /api/users (admins), and the assignee picker. */
export function registerUsersApi(): void {
  const route = routesOf('Users');
  route({
    method: 'get',
    path: '/users/assignees',
    summary: 'Active accounts an assignment may go to',
    query: assigneesQuery,
    ok: { status: 200, description: 'The accounts', schema: itemsOf(assigneeSchema) },
    errors: [403],
  });
  route({
    method: 'get',
    path: '/users',
    summary: 'Accounts, a page at a time (admins)',
    query: listQuery,
    ok: { status: 200, description: 'A page of accounts', schema: pageOf(userSchema) },
    errors: [403],
  });
  route({
    method: 'post',
    path: '/users',
    summary: 'Creates an account (admins)',
    body: createBody,
    ok: { status: 201, description: 'The new account', schema: userSchema },
    errors: [403, 409],
  });
  route({
    method: 'get',
    path: '/users/:id',
    summary: 'One account (admins)',
    params: idParams,
    ok: { status: 200, description: 'The account', schema: userSchema },
    errors: [403, 404],
  });
  route({
    method: 'patch',
    path: '/users/:id',
    summary: 'Changes an account: name, role, active, password (admins)',
    params: idParams,
    body: updateBody,
    ok: { status: 200, description: 'The changed account', schema: userSchema },
    errors: [403, 404, 409],
  });
}
