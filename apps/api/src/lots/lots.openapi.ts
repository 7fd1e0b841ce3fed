import type { LotDto } from '@rhotrace/api-types';
import { MATERIALS } from '@rhotrace/api-types';
import { z } from 'zod';
import { registerCrud, registry } from '../openapi/registry';
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
  registerCrud({
    tag: 'Lots',
    path: '/lots',
    item: lotDtoSchema,
    names: ['lot', 'lots'],
    list: {
      summary: 'Lots the caller may see, a page at a time',
      query: lotListQuery,
      schema: pageOf(lotDtoSchema),
    },
    create: { summary: 'Creates a lot', body: lotCreateBody },
    read: { summary: 'One lot' },
    update: { summary: 'Changes some fields of a lot', body: lotUpdateBody },
    remove: { summary: 'Deletes a lot without wafers' },
  });
}
