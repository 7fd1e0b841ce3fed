import type { WaferDto } from '@rhotrace/api-types';
import { WAFER_STATES } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registry, routesOf } from '../openapi/registry';
import { pageOf, timestamps } from '../openapi/shapes';
import { createBody, listQuery, lotListQuery, updateBody } from './wafers.schemas';

/** A wafer as the API answers it. */
export const waferDtoSchema = registry.register(
  'Wafer',
  z
    .object({
      id: z.number().int(),
      lotId: z.number().int(),
      lotCode: z.string().optional(),
      number: z.string(),
      thicknessCm: z.number().nullable(),
      state: z.enum(WAFER_STATES),
      notes: z.string().nullable(),
      ...timestamps,
    })
    .strict(),
) satisfies z.ZodType<WaferDto>;

/** /api/wafers and /api/lots/:id/wafers */
export function registerWafersApi(): void {
  const route = routesOf('Wafers');
  const page = pageOf(waferDtoSchema);
  route({
    method: 'get',
    path: '/lots/:id/wafers',
    summary: "A lot's wafers the caller may see",
    params: idParams,
    query: lotListQuery,
    ok: { status: 200, description: 'A page of wafers', schema: page },
    errors: [404],
  });
  route({
    method: 'post',
    path: '/lots/:id/wafers',
    summary: 'Adds a wafer to a lot',
    params: idParams,
    body: createBody,
    ok: { status: 201, description: 'The new wafer', schema: waferDtoSchema },
    errors: [403, 404, 409],
  });
  route({
    method: 'get',
    path: '/wafers',
    summary: 'Wafers the caller may see, across lots',
    query: listQuery,
    ok: { status: 200, description: 'A page of wafers', schema: page },
  });
  route({
    method: 'get',
    path: '/wafers/:id',
    summary: 'One wafer',
    params: idParams,
    ok: { status: 200, description: 'The wafer', schema: waferDtoSchema },
    errors: [404],
  });
  route({
    method: 'patch',
    path: '/wafers/:id',
    summary: 'Changes some fields of a wafer',
    params: idParams,
    body: updateBody,
    ok: { status: 200, description: 'The changed wafer', schema: waferDtoSchema },
    errors: [403, 404, 409],
  });
  route({
    method: 'delete',
    path: '/wafers/:id',
    summary: 'Deletes a wafer without sweeps',
    params: idParams,
    ok: { status: 204, description: 'Deleted' },
    errors: [403, 404, 409],
  });
}
