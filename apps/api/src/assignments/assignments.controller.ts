import type { Request, Response } from 'express';
import type { AssignmentDto, Page } from '@rhotrace/api-types';
import type { AppDeps } from '../deps';
import { actorOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import { parseId, parseOrThrow } from '../middleware/validate';
import {
  createAssignment,
  getAssignment,
  listAssignments,
  updateAssignment,
} from './assignments.service';
import { createBody, updateBody, listQuery, overdueQuery } from './assignments.schemas';

/** Handlers of /api/assignments. */
export function assignmentsController(deps: AppDeps) {
  const mail = { mailer: deps.mailer, publicUrl: deps.config.publicUrl };
  return {
    async list(req: Request, res: Response<Page<AssignmentDto>>) {
      const query = parseOrThrow(listQuery, req.query, 'query');
      res.json(await listAssignments(currentUser(req), query));
    },
    async overdue(req: Request, res: Response<Page<AssignmentDto>>) {
      const query = parseOrThrow(overdueQuery, req.query, 'query');
      res.json(await listAssignments(currentUser(req), { ...query, overdue: true }));
    },
    async get(req: Request, res: Response<AssignmentDto>) {
      res.json(await getAssignment(currentUser(req), parseId(req.params)));
    },
    async create(req: Request, res: Response<AssignmentDto>) {
      const body = parseOrThrow(createBody, req.body, 'body');
      const actor = { ...actorOf(req), name: currentUser(req).name };
      res.status(201).json(await createAssignment(body, actor, mail));
    },
    async update(req: Request, res: Response<AssignmentDto>) {
      const assignmentId = parseId(req.params);
      const body = parseOrThrow(updateBody, req.body, 'body');
      const changes = Object.fromEntries(
        Object.entries(body).filter(([, v]) => v !== undefined),
      ) as typeof body;
      res.json(await updateAssignment(currentUser(req), assignmentId, changes, actorOf(req), mail));
    },
  };
}
