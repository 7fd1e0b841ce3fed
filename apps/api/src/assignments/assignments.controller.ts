import type { Request, Response } from 'express';
import {
  ASSIGNMENT_SORT_FIELDS,
  ASSIGNMENT_STATES,
  type AssignmentDto,
  type Page,
} from '@rhotrace/api-types';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { actorOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import {
  booleanParam,
  isoDate,
  LIMITS,
  listQuerySchema,
  optionalText,
  requiredText,
} from '../middleware/fields';
import { idParam, parseId, parseOrThrow } from '../middleware/validate';
import {
  createAssignment,
  getAssignment,
  listAssignments,
  updateAssignment,
} from './assignments.service';

const state = z.enum(ASSIGNMENT_STATES, {
  errorMap: () => ({ message: `must be one of ${ASSIGNMENT_STATES.join(', ')}` }),
});
const id = z
  .number({ required_error: 'is required', invalid_type_error: 'must be a whole number' })
  .int('must be a whole number')
  .positive('must be positive')
  .max(2_147_483_647, 'is too large');
const fields = {
  waferId: id,
  assigneeId: id,
  task: requiredText(500),
  dueDate: isoDate,
  notes: optionalText(LIMITS.notes),
};

const createBody = z
  .object({ ...fields, notes: fields.notes.transform((v) => v ?? null) })
  .strict();
const updateBody = z
  .object({
    state: state.optional(),
    task: fields.task.optional(),
    dueDate: fields.dueDate.optional(),
    notes: fields.notes,
    assigneeId: fields.assigneeId.optional(),
  })
  .strict();
const listQuery = listQuerySchema(ASSIGNMENT_SORT_FIELDS, {
  assignee: z
    .union([z.literal('me'), idParam], {
      errorMap: () => ({ message: 'must be "me" or a user id' }),
    })
    .optional(),
  state: state.optional(),
  waferId: idParam.optional(),
  overdue: booleanParam,
});
const overdueQuery = listQuerySchema(ASSIGNMENT_SORT_FIELDS, { assignee: idParam.optional() });

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
