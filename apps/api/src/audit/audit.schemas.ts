import { DEFAULT_PAGE_SIZE, MAX_PAGE_SIZE } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParam, paginationSchema } from '../middleware/validate';

export const listQuery = z
  .object({
    ...paginationSchema(MAX_PAGE_SIZE, DEFAULT_PAGE_SIZE),
    entity: z.string().max(32, 'must be at most 32 characters').optional(),
    id: z.string().max(64, 'must be at most 64 characters').optional(),
    actorId: idParam.optional(),
    action: z.string().max(24, 'must be at most 24 characters').optional(),
  })
  .strict();

/** `GET /api/{lots,wafers,stations}/:id/history`: a page of one record's trail. */
export const historyQuery = z.object(paginationSchema(MAX_PAGE_SIZE, DEFAULT_PAGE_SIZE)).strict();
