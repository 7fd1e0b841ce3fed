import type { AssigneeDto, UserDto } from '@rhotrace/api-types';
import { ROLES } from '@rhotrace/api-types';
import { z } from 'zod';
import { registerCrud, registry, routesOf } from '../openapi/registry';
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
  registerCrud({
    tag: 'Users',
    path: '/users',
    item: userSchema,
    names: ['account', 'accounts'],
    list: {
      summary: 'Accounts, a page at a time (admins)',
      query: listQuery,
      schema: pageOf(userSchema),
      errors: [403],
    },
    create: { summary: 'Creates an account (admins)', body: createBody },
    read: { summary: 'One account (admins)', errors: [403, 404] },
    update: {
      summary: 'Changes an account: name, role, active, password (admins)',
      body: updateBody,
    },
  });
}
