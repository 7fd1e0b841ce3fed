import { HALL_FACTOR_NAMES, SWEEP_METHODS } from '@rhotrace/api-types';
import { SITE_PATTERN_IDS } from '@rhotrace/physics';
import { z } from 'zod';
import { columnsSchema } from '../sweeps/sweep.schemas';

/** A length in cm, as saved geometry. */
const length = z
  .number()
  .finite()
  .positive('must be above 0 cm')
  .max(100, 'must be at most 100 cm');

/** A saved Hall factor: a number from 0.5 to 3 or a named scattering factor (as the upload's). */
const hallFactorValue = z.union([z.enum(HALL_FACTOR_NAMES), z.number().finite().min(0.5).max(3)], {
  errorMap: () => ({
    message: `must be a number between 0.5 and 3 or one of ${HALL_FACTOR_NAMES.join(', ')}`,
  }),
});

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
    hallFactor: hallFactorValue.optional(),
    map: z
      .object({
        sitePattern: z
          .enum(SITE_PATTERN_IDS, {
            errorMap: () => ({ message: `must be one of ${SITE_PATTERN_IDS.join(', ')}` }),
          })
          .optional(),
        edgeExclusionMm: z
          .number()
          .finite()
          .min(0, 'must be at least 0 mm')
          .max(100, 'must be at most 100 mm')
          .optional(),
      })
      .strict()
      .optional(),
  })
  .strict();

/** `GET /api/import-settings?stationId=`. */
export const listQuery = z
  .object({ stationId: z.coerce.number().int().positive().optional() })
  .strict();
