import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { wafersController as c } from './wafers.controller';

/** /api/wafers and /api/lots/:id/wafers: everyone reads what they may see; editors write. */
export function wafersRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  const editors = requireCapability('records:edit');
  router.get('/lots/:id/wafers', signedIn, c.listInLot);
  router.post('/lots/:id/wafers', signedIn, editors, c.create);
  router.get('/wafers', signedIn, c.list);
  router.get('/wafers/:id', signedIn, c.get);
  router.patch('/wafers/:id', signedIn, editors, c.update);
  router.delete('/wafers/:id', signedIn, editors, c.remove);
  return router;
}
