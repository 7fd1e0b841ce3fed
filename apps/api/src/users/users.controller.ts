import type { Request, Response } from 'express';
import type { AssigneeDto, Page, UserDto } from '@rhotrace/api-types';
import { actorOf } from '../middleware/actor';
import { parseId, parseOrThrow } from '../middleware/validate';
import {
  createUser,
  getUser,
  listAssignees,
  listUsers,
  toUserDto,
  updateUser,
} from './users.service';
import { assigneesQuery, createBody, listQuery, updateBody } from './users.schemas';

/** Handlers of /api/users (admin only, but for the assignee picker). */
export const usersController = {
  async list(req: Request, res: Response<Page<UserDto>>) {
    res.json(await listUsers(parseOrThrow(listQuery, req.query, 'query')));
  },
  async assignees(req: Request, res: Response<{ items: AssigneeDto[] }>) {
    parseOrThrow(assigneesQuery, req.query, 'query');
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
