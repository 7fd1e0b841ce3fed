import { COLUMN_MEANINGS, HALL_FACTOR_NAMES, SWEEP_METHODS } from '@rhotrace/api-types';
import { SITE_PATTERN_IDS } from '@rhotrace/physics';
import { z } from 'zod';

/** A length in cm, as a form field. */
const length = z.coerce
  .number({ invalid_type_error: 'must be a number (cm)' })
  .finite('must be a finite number (cm)')
  .positive('must be above 0 cm')
  .max(100, 'must be at most 100 cm')
  .optional();

/** A Hall factor r_H, as a form field: a number or one of the named scattering factors. */
const hallFactor = z.preprocess(
  (v) => (v === '' ? undefined : v),
  z
    .union(
      [
        z.enum(HALL_FACTOR_NAMES),
        z.coerce
          .number()
          .finite()
          .min(0.5, 'must be between 0.5 and 3')
          .max(3, 'must be between 0.5 and 3'),
      ],
      {
        errorMap: () => ({
          message: `must be a number between 0.5 and 3 or one of ${HALL_FACTOR_NAMES.join(', ')}`,
        }),
      },
    )
    .optional(),
);

/** The column mapping an upload may send as JSON in its `columns` field. */
export const columnsSchema = z.array(
  z
    .object({
      index: z.number().int().min(0),
      meaning: z.enum(COLUMN_MEANINGS),
      unit: z.string().max(32).nullable().optional(),
    })
    .strict(),
);

/** The text fields of an upload (besides the file). */
export const storeSchema = z
  .object({
    method: z.enum(SWEEP_METHODS, {
      errorMap: () => ({ message: `must be one of ${SWEEP_METHODS.join(', ')}` }),
    }),
    stationId: z.preprocess(
      (v) => (v === '' ? undefined : v),
      z.coerce.number().int().positive().optional(),
    ),
    columns: z.string().max(100_000).optional(),
    delimiter: z.enum([',', ';', '\t']).optional(),
    decimalMark: z.enum(['.', ',']).optional(),
    thicknessCm: length,
    diameterCm: length,
    spacingCm: length,
    barLengthCm: length,
    barWidthCm: length,
    sitePattern: z.preprocess(
      (v) => (v === '' ? undefined : v),
      z
        .enum(SITE_PATTERN_IDS, {
          errorMap: () => ({ message: `must be one of ${SITE_PATTERN_IDS.join(', ')}` }),
        })
        .optional(),
    ),
    edgeExclusionMm: z.preprocess(
      (v) => (v === '' ? undefined : v),
      z.coerce
        .number({ invalid_type_error: 'must be a number (mm)' })
        .finite('must be a finite number (mm)')
        .min(0, 'must be at least 0 mm')
        .max(100, 'must be at most 100 mm')
        .optional(),
    ),
    hallFactor,
  })
  .strict();

/** The text fields of a preview: the store's, all optional (the method defaults to the guess). */
export const previewSchema = storeSchema.partial();
