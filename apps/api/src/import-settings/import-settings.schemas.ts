import { SWEEP_METHODS } from '@rhotrace/api-types';
import { z } from 'zod';
import { columnsSchema } from '../sweeps/sweep.schemas';

/** A length in cm, as saved geometry. */
const length = z
  .number()
  .finite()
  .positive('must be above 0 cm')
  .max(100, 'must be at most 100 cm');

/** `PUT /api/import-settings`. */
export const saveBody = z
  .object({
    stationId: z.number().int().positive(),
    shape: z.string().regex(/^[0-9a-f]{64}$/, 'must be the shape key the preview gave'),
    shapeLabel: z.string().trim().min(1).max(500).optional(),
    method: z.enum(SWEEP_METHODS, {
      errorMap: () => ({ message: `must be one of ${SWEEP_METHODS.join(', ')}` }),
    }),
    columns: columnsSchema.max(200),
    geometry: z
      .object({
        thicknessCm: length.optional(),
        diameterCm: length.optional(),
        spacingCm: length.optional(),
        barLengthCm: length.optional(),
        barWidthCm: length.optional(),
      })
      .strict(),
    layout: z
      .object({
        delimiter: z.enum([',', ';', '\t']).optional(),
        decimalMark: z.enum(['.', ',']).optional(),
      })
      .strict(),
  })
  .strict();

/** `GET /api/import-settings?stationId=`. */
export const listQuery = z
  .object({ stationId: z.coerce.number().int().positive().optional() })
  .strict();
