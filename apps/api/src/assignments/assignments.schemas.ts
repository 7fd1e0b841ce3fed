import { ASSIGNMENT_SORT_FIELDS, ASSIGNMENT_STATES } from '@rhotrace/api-types';
import { z } from 'zod';
import {
  booleanParam,
  isoDate,
  LIMITS,
  listQuerySchema,
  optionalText,
  requiredText,
} from '../middleware/fields';
import { idParam } from '../middleware/validate';
import { plannerSchema } from '../planner/planner.schemas';

export const state = z.enum(ASSIGNMENT_STATES, {
  errorMap: () => ({ message: `must be one of ${ASSIGNMENT_STATES.join(', ')}` }),
});

export const id = z
  .number({ required_error: 'is required', invalid_type_error: 'must be a whole number' })
  .int('must be a whole number')
  .positive('must be positive')
  .max(2_147_483_647, 'is too large');

export const fields = {
  waferId: id,
  assigneeId: id,
  task: requiredText(500),
  dueDate: isoDate,
  notes: optionalText(LIMITS.notes),
  /** The probe station to measure on (optional); its station token may post the sweep. */
  stationId: id.nullable(),
};

export const createBody = z
  .object({
    ...fields,
    notes: fields.notes.transform((v) => v ?? null),
    stationId: fields.stationId.optional().default(null),
    plan: plannerSchema.optional(),
  })
  .strict();

export const updateBody = z
  .object({
    state: state.optional(),
    task: fields.task.optional(),
    dueDate: fields.dueDate.optional(),
    notes: fields.notes,
    assigneeId: fields.assigneeId.optional(),
    stationId: fields.stationId.optional(),
    plan: plannerSchema.nullable().optional(),
  })
  .strict();

export const listQuery = listQuerySchema(ASSIGNMENT_SORT_FIELDS, {
  assignee: z
    .union([z.literal('me'), idParam], {
      errorMap: () => ({ message: 'must be "me" or a user id' }),
    })
    .optional(),
  state: state.optional(),
  waferId: idParam.optional(),
  overdue: booleanParam,
  /** true: only assigned or in progress; false: only done or cancelled. */
  open: booleanParam,
});

export const overdueQuery = listQuerySchema(ASSIGNMENT_SORT_FIELDS, {
  assignee: idParam.optional(),
});
