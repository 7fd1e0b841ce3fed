import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate, requireRole } from '../middleware/authenticate';
import { lotsController as c } from './lots.controller';

/** Roles that create and edit lots, wafers and specs; physicists and technicians only read. */
export const RECORD_EDITORS = ['admin', 'manager', 'engineer'] as const;

/** /api/lots: everyone reads (technicians only lots holding their wafers); editors write. */
export function lotsRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  const editors = requireRole(...RECORD_EDITORS);
  router.get('/lots', signedIn, c.list);
  router.post('/lots', signedIn, editors, c.create);
  router.get('/lots/:id', signedIn, c.get);
  router.patch('/lots/:id', signedIn, editors, c.update);
  router.delete('/lots/:id', signedIn, editors, c.remove);
  return router;
}
