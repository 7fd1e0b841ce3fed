import { SWEEP_METHODS } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParam } from '../middleware/validate';
import { storeSchema } from '../sweeps/sweep.schemas';

/**
 * The text fields of a station post: the wafer, and what an ordinary upload takes (method,
 * column mapping, geometry), but no station: that is the token's.
 */
export const stationPostFields = storeSchema
  .omit({ stationId: true, method: true })
  .extend({
    waferId: idParam,
    method: z
      .enum(SWEEP_METHODS, {
        errorMap: () => ({ message: `must be one of ${SWEEP_METHODS.join(', ')}` }),
      })
      .optional(),
  })
  .strict();

/**
 * The `Idempotency-Key` header: 1 to 255 visible ASCII characters (a UUID is usual). The same
 * key from the same station is the same post.
 */
export const idempotencyHeaders = z.object({
  'Idempotency-Key': z
    .string({ required_error: 'is required: send a key unique to this sweep, e.g. a UUID' })
    .min(1, 'must not be empty')
    .max(255, 'must be at most 255 characters')
    .regex(/^[\x21-\x7e]+$/, 'must be visible ASCII characters without spaces'),
});
