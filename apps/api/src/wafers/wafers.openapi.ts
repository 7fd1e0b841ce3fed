import type { WaferDto } from '@rhotrace/api-types';
import { WAFER_STATES } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registerCrud, registry, routesOf } from '../openapi/registry';
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
      countedSweepId: z.number().int().nullable(),
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
  registerCrud({
    tag: 'Wafers',
    path: '/wafers',
    item: waferDtoSchema,
    names: ['wafer', 'wafers'],
    list: { summary: 'Wafers the caller may see, across lots', query: listQuery, schema: page },
    read: { summary: 'One wafer' },
    update: { summary: 'Changes some fields of a wafer', body: updateBody },
    remove: { summary: 'Deletes a wafer without sweeps' },
  });
}
