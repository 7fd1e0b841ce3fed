import { DEFAULT_RECENT_LIMIT, MAX_RECENT_LIMIT } from '@rhotrace/api-types';
import { z } from 'zod';

/** `limit` of the recent-activity lists: 1 to MAX_RECENT_LIMIT, default DEFAULT_RECENT_LIMIT. */
const recentLimit = z.coerce
  .number({ invalid_type_error: 'must be a whole number' })
  .int('must be a whole number')
  .min(1, 'must be at least 1')
  .max(MAX_RECENT_LIMIT, `must be at most ${MAX_RECENT_LIMIT}`)
  .default(DEFAULT_RECENT_LIMIT);

/** Query of `GET /api/sweeps/recent`. */
export const recentSweepsQuery = z.object({ limit: recentLimit }).strict();

/** Query of `GET /api/fits/recent`: `mine=true` keeps only the caller's own fits. */
export const recentFitsQuery = z
  .object({
    limit: recentLimit,
    mine: z
      .enum(['true', 'false'], { message: 'must be true or false' })
      .optional()
      .transform((v) => v === 'true'),
  })
  .strict();
