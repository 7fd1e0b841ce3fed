import type { ImportSettingsDto } from '@rhotrace/api-types';
import { SWEEP_METHODS } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registry, routesOf } from '../openapi/registry';
import { dateTime } from '../openapi/shapes';
import { columnsSchema } from '../sweeps/sweep.schemas';
import { listQuery, saveBody } from './import-settings.schemas';

/** Saved import settings as the API answers them. */
export const importSettingsSchema = registry.register(
  'ImportSettings',
  z
    .object({
      id: z.number().int(),
      stationId: z.number().int(),
      stationName: z.string().nullable(),
      shape: z.string().regex(/^[0-9a-f]{64}$/),
      shapeLabel: z.string(),
      method: z.enum(SWEEP_METHODS),
      columns: columnsSchema,
      // what was saved passed the save body's checks, so the answer reads back in its shapes
      geometry: saveBody.shape.geometry,
      layout: saveBody.shape.layout,
      savedById: z.number().int().nullable(),
      savedByName: z.string().nullable(),
      updatedAt: dateTime,
      hallFactor: saveBody.shape.hallFactor.unwrap().nullable(),
      map: saveBody.shape.map.unwrap().nullable(),
    })
    .strict(),
) satisfies z.ZodType<ImportSettingsDto>;

/** /api/import-settings */
export function registerImportSettingsApi(): void {
  const route = routesOf('Import settings');
  route({
    method: 'get',
    path: '/import-settings',
    summary: 'Saved import settings, of one station or all, newest first',
    query: listQuery,
    ok: { status: 200, description: 'The settings', schema: z.array(importSettingsSchema) },
    errors: [403],
  });
  route({
    method: 'put',
    path: '/import-settings',
    summary: 'Saves (or replaces) how files of one shape from one station are read',
    body: saveBody,
    ok: { status: 200, description: 'The saved settings', schema: importSettingsSchema },
    errors: [403],
  });
  route({
    method: 'delete',
    path: '/import-settings/:id',
    summary: 'Deletes saved import settings',
    params: idParams,
    ok: { status: 204, description: 'Deleted' },
    errors: [403, 404],
  });
}
