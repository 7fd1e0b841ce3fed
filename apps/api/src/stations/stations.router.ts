import { Router } from 'express';
import type { AppDeps } from '../deps';
import { RECORD_EDITORS } from '../lots/lots.router';
import { authenticate, requireRole } from '../middleware/authenticate';
import { stationsController as c } from './stations.controller';

/** /api/stations: every role reads; admin, manager and engineer register and edit. */
export function stationsRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  const editors = requireRole(...RECORD_EDITORS);
  router.get('/stations', signedIn, c.list);
  router.post('/stations', signedIn, editors, c.create);
  router.get('/stations/:id', signedIn, c.get);
  router.patch('/stations/:id', signedIn, editors, c.update);
  router.delete('/stations/:id', signedIn, editors, c.remove);
  return router;
}
