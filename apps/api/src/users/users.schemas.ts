import { ROLES, USER_SORT_FIELDS } from '@rhotrace/api-types';
import { z } from 'zod';
import { passwordField } from '../auth/auth.schemas';
import {
  booleanParam,
  LIMITS,
  listQuerySchema,
  requiredText,
  searchParam,
} from '../middleware/fields';

export const role = z.enum(ROLES, {
  errorMap: () => ({ message: `must be one of ${ROLES.join(', ')}` }),
});

export const createBody = z
  .object({
    email: z
      .string({ required_error: 'is required', invalid_type_error: 'must be text' })
      .max(254, 'must be at most 254 characters')
      .email('must be an e-mail address'),
    name: requiredText(LIMITS.name),
    role,
    password: passwordField,
  })
  .strict();

export const updateBody = z
  .object({
    name: requiredText(LIMITS.name).optional(),
    role: role.optional(),
    active: z.boolean({ invalid_type_error: 'must be true or false' }).optional(),
    password: passwordField.optional(),
    reassignTo: z
      .number({ invalid_type_error: 'must be a user id' })
      .int('must be a user id')
      .positive('must be a user id')
      .optional(),
  })
  .strict()
  .refine((b) => b.reassignTo === undefined || b.active === false, {
    message: 'is only taken with active: false (handing over the open tasks of a deactivation)',
    path: ['reassignTo'],
  });

export const listQuery = listQuerySchema(USER_SORT_FIELDS, {
  q: searchParam,
  role: role.optional(),
  active: booleanParam,
});

/** `GET /api/users/assignees` takes no parameters. */
export const assigneesQuery = z.object({}).strict();
