import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate } from '../middleware/authenticate';
import { searchController as c } from './search.controller';

/** /api/search: lots, wafers, sweep files and (for those who assign) people, by name. */
export function searchRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/search', authenticate(deps.config.jwtSecret), c.search);
  return router;
}
