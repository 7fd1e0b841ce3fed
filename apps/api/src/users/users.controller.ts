import type { Request, Response } from 'express';
import {
  ROLES,
  USER_SORT_FIELDS,
  type AssigneeDto,
  type Page,
  type UserDto,
} from '@rhotrace/api-types';
import { z } from 'zod';
import { passwordField } from '../auth/auth.controller';
import { actorOf } from '../middleware/actor';
import {
  booleanParam,
  LIMITS,
  listQuerySchema,
  requiredText,
  searchParam,
} from '../middleware/fields';
import { parseId, parseOrThrow } from '../middleware/validate';
import {
  createUser,
  getUser,
  listAssignees,
  listUsers,
  toUserDto,
  updateUser,
} from './users.service';

const role = z.enum(ROLES, { errorMap: () => ({ message: `must be one of ${ROLES.join(', ')}` }) });

const createBody = z
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

const updateBody = z
  .object({
    name: requiredText(LIMITS.name).optional(),
    role: role.optional(),
    active: z.boolean({ invalid_type_error: 'must be true or false' }).optional(),
    password: passwordField.optional(),
  })
  .strict();

const listQuery = listQuerySchema(USER_SORT_FIELDS, {
  q: searchParam,
  role: role.optional(),
  active: booleanParam,
});

/** Handlers of /api/users (admin only, but for the assignee picker). */
export const usersController = {
  async list(req: Request, res: Response<Page<UserDto>>) {
    res.json(await listUsers(parseOrThrow(listQuery, req.query, 'query')));
  },
  async assignees(req: Request, res: Response<{ items: AssigneeDto[] }>) {
    parseOrThrow(z.object({}).strict(), req.query, 'query');
    res.json({ items: await listAssignees() });
  },
  async get(req: Request, res: Response<UserDto>) {
    res.json(toUserDto(await getUser(parseId(req.params))));
  },
  async create(req: Request, res: Response<UserDto>) {
    const body = parseOrThrow(createBody, req.body, 'body');
    res.status(201).json(toUserDto(await createUser(body, actorOf(req))));
  },
  async update(req: Request, res: Response<UserDto>) {
    const id = parseId(req.params);
    const body = parseOrThrow(updateBody, req.body, 'body');
    res.json(toUserDto(await updateUser(id, body, actorOf(req))));
  },
};
