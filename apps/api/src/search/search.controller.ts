import type { Request, Response } from 'express';
import type { SearchResponse } from '@rhotrace/api-types';
import { currentUser } from '../middleware/authenticate';
import { parseOrThrow } from '../middleware/validate';
import { searchQuery } from './search.schemas';
import { search } from './search.service';

/** Handlers of /api/search. */
export const searchController = {
  async search(req: Request, res: Response<SearchResponse>) {
    const query = parseOrThrow(searchQuery, req.query, 'query');
    res.json(await search(currentUser(req), query));
  },
};
