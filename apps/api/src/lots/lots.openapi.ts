import type { LotDto } from '@rhotrace/api-types';
import { MATERIALS } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registerRoute, registry } from '../openapi/registry';
import { pageOf, timestamps } from '../openapi/shapes';
import { lotCreateBody, lotListQuery, lotUpdateBody } from './lots.schemas';

/** A lot as the API answers it. */
export const lotDtoSchema = registry.register(
  'Lot',
  z
    .object({
      id: z.number().int(),
      code: z.string(),
      material: z.enum(MATERIALS),
      dopant: z.string().nullable(),
      dopantType: z.enum(['n', 'p']).nullable(),
      orientation: z.string().nullable(),
      diameterCm: z.number().nullable(),
      thicknessCm: z.number().nullable(),
      thicknessToleranceCm: z.number().nullable(),
      supplier: z.string().nullable(),
      receivedOn: z.string().date().nullable(),
      specMinOhmCm: z.number().nullable(),
      specMaxOhmCm: z.number().nullable(),
      notes: z.string().nullable(),
      waferCount: z.number().int().optional(),
      ...timestamps,
    })
    .strict(),
) satisfies z.ZodType<LotDto>;

/** /api/lots */
export function registerLotsApi(): void {
  const tag = 'Lots';
  registerRoute({
    method: 'get',
    path: '/lots',
    tag,
    summary: 'Lots the caller may see, a page at a time',
    auth: 'user',
    query: lotListQuery,
    ok: { status: 200, description: 'A page of lots', schema: pageOf(lotDtoSchema) },
  });
  registerRoute({
    method: 'post',
    path: '/lots',
    tag,
    summary: 'Creates a lot',
    auth: 'user',
    body: lotCreateBody,
    ok: { status: 201, description: 'The new lot', schema: lotDtoSchema },
    errors: [403, 409],
  });
  registerRoute({
    method: 'get',
    path: '/lots/:id',
    tag,
    summary: 'One lot',
    auth: 'user',
    params: idParams,
    ok: { status: 200, description: 'The lot', schema: lotDtoSchema },
    errors: [404],
  });
  registerRoute({
    method: 'patch',
    path: '/lots/:id',
    tag,
    summary: 'Changes some fields of a lot',
    auth: 'user',
    params: idParams,
    body: lotUpdateBody,
    ok: { status: 200, description: 'The changed lot', schema: lotDtoSchema },
    errors: [403, 404, 409],
  });
  registerRoute({
    method: 'delete',
    path: '/lots/:id',
    tag,
    summary: 'Deletes a lot without wafers',
    auth: 'user',
    params: idParams,
    ok: { status: 204, description: 'Deleted' },
    errors: [403, 404, 409],
  });
}
