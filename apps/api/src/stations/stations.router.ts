import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { stationsController as c } from './stations.controller';

/** /api/stations: every role reads; `stations:edit` registers and edits. */
export function stationsRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  const editors = requireCapability('stations:edit');
  router.get('/stations', signedIn, c.list);
  router.post('/stations', signedIn, editors, c.create);
  router.get('/stations/:id', signedIn, c.get);
  router.patch('/stations/:id', signedIn, editors, c.update);
  router.delete('/stations/:id', signedIn, editors, c.remove);
  return router;
}
