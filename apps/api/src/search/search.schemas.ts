import { MAX_PAGE_SIZE, SEARCH_KINDS } from '@rhotrace/api-types';
import { z } from 'zod';
import { paginationSchema } from '../middleware/validate';

/** `GET /api/search`: what to look for, optionally one kind a page at a time. */
export const searchQuery = z
  .object({
    q: z
      .string({ invalid_type_error: 'must be text' })
      .trim()
      .max(100, 'must be at most 100 characters')
      .optional()
      .default(''),
    kind: z
      .enum(SEARCH_KINDS, {
        errorMap: () => ({ message: `must be one of ${SEARCH_KINDS.join(', ')}` }),
      })
      .optional(),
    ...paginationSchema(MAX_PAGE_SIZE, 20),
  })
  .strict();
