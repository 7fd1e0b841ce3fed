import type { AuditEventDto } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, routesOf } from '../openapi/registry';
import { dateTime, jsonValue, pageOf } from '../openapi/shapes';
import { historyQuery, listQuery } from './audit.schemas';

const auditEventSchema = z
  .object({
    id: z.number().int(),
    actorId: z.number().int().nullable(),
    actorEmail: z.string().nullable().optional(),
    action: z.string(),
    entity: z.string(),
    entityId: z.string(),
    before: jsonValue,
    after: jsonValue,
    requestId: z.string().nullable(),
    recordName: z.string().nullable(),
    changes: z.array(
      z
        .object({
          field: z.string(),
          label: z.string(),
          before: z.string().nullable(),
          after: z.string().nullable(),
        })
        .strict(),
    ),
    createdAt: dateTime,
  })
  .strict() satisfies z.ZodType<AuditEventDto>;

/** /api/audit */
export function registerAuditApi(): void {
  routesOf('Audit trail')({
    method: 'get',
    path: '/audit',
    summary: 'The audit trail, newest first',
    query: listQuery,
    ok: { status: 200, description: 'A page of events', schema: pageOf(auditEventSchema) },
    errors: [403],
  });
  for (const of of ['lots', 'wafers', 'stations'] as const) {
    routesOf('Audit trail')({
      method: 'get',
      path: `/${of}/:id/history`,
      summary: `One of the ${of}' history (for anyone who may see it), newest first`,
      params: idParams,
      query: historyQuery,
      ok: { status: 200, description: 'A page of events', schema: pageOf(auditEventSchema) },
      errors: [404],
    });
  }
}
