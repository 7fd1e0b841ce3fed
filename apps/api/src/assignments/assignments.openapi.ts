import type { AssignmentDto } from '@rhotrace/api-types';
import { ASSIGNMENT_STATES } from '@rhotrace/api-types';
import { z } from 'zod';
import { registerCrud, registry, routesOf } from '../openapi/registry';
import { dateTime, pageOf, timestamps } from '../openapi/shapes';
import { assignmentPlanSchema } from '../planner/planner.openapi';
import { createBody, listQuery, overdueQuery, updateBody } from './assignments.schemas';

/** An assignment as the API answers it. */
export const assignmentDtoSchema = registry.register(
  'Assignment',
  z
    .object({
      id: z.number().int(),
      waferId: z.number().int(),
      waferNumber: z.string().optional(),
      lotCode: z.string().optional(),
      assigneeId: z.number().int(),
      assigneeName: z.string().optional(),
      assignedById: z.number().int(),
      task: z.string(),
      dueDate: z.string().date(),
      state: z.enum(ASSIGNMENT_STATES),
      notes: z.string().nullable(),
      overdue: z.boolean(),
      safetyCautions: z.array(z.string()).optional(),
      plan: assignmentPlanSchema.nullable().optional(),
      sweeps: z
        .array(
          z
            .object({ id: z.number().int(), originalName: z.string(), createdAt: dateTime })
            .strict(),
        )
        .optional()
        .describe('The sweeps the assignee uploaded that fulfil this task'),
      stationId: z.number().int().nullable().optional(),
      stationUpload: z
        .object({
          sweepId: z.number().int(),
          stationName: z.string(),
          tokenLabel: z.string(),
          postedAt: dateTime,
        })
        .strict()
        .nullable()
        .optional(),
      ...timestamps,
    })
    .strict(),
) satisfies z.ZodType<AssignmentDto>;

/** /api/assignments */
export function registerAssignmentsApi(): void {
  const route = routesOf('Assignments');
  const page = pageOf(assignmentDtoSchema);
  route({
    method: 'get',
    path: '/assignments/overdue',
    summary: 'Open assignments past their due date (for those who assign)',
    query: overdueQuery,
    ok: { status: 200, description: 'A page of assignments', schema: page },
    errors: [403],
  });
  registerCrud({
    tag: 'Assignments',
    path: '/assignments',
    item: assignmentDtoSchema,
    names: ['assignment', 'assignments'],
    list: {
      summary: 'Assignments (technicians: their own)',
      query: listQuery,
      schema: page,
      errors: [403],
    },
    create: {
      summary: 'Assigns a wafer to someone, with an e-mail to them',
      body: createBody,
      errors: [403, 404, 409],
    },
    read: { summary: 'One assignment' },
    update: {
      summary: 'Changes an assignment (its assignee may move the state)',
      body: updateBody,
    },
  });
}
