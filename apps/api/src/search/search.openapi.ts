import { ROLES, SEARCH_KINDS, type SearchResponse } from '@rhotrace/api-types';
import { z } from 'zod';
import { registry, routesOf } from '../openapi/registry';
import { searchQuery } from './search.schemas';

const hit = z
  .object({
    kind: z.enum(SEARCH_KINDS),
    id: z.number().int(),
    title: z.string(),
    detail: z.string(),
    waferId: z.number().int().nullable(),
    role: z.enum(ROLES).optional(),
  })
  .strict();

/** The answer of `GET /api/search`. */
export const searchResponseSchema = registry.register(
  'SearchResponse',
  z
    .object({
      q: z.string(),
      groups: z.array(
        z
          .object({
            kind: z.enum(SEARCH_KINDS),
            items: z.array(hit),
            total: z.number().int(),
            page: z.number().int(),
            pageSize: z.number().int(),
          })
          .strict(),
      ),
    })
    .strict(),
) satisfies z.ZodType<SearchResponse>;

/** /api/search */
export function registerSearchApi(): void {
  routesOf('Search')({
    method: 'get',
    path: '/search',
    summary: 'Lots, wafers, sweep files and people whose names hold q (what the caller may see)',
    query: searchQuery,
    ok: { status: 200, description: 'Hits by kind', schema: searchResponseSchema },
    errors: [],
  });
}
