import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { lotsController as c } from './lots.controller';

/** /api/lots: everyone reads the lots they may see; `records:edit` writes. */
export function lotsRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  const editors = requireCapability('records:edit');
  router.get('/lots', signedIn, c.list);
  router.post('/lots', signedIn, editors, c.create);
  router.get('/lots/:id', signedIn, c.get);
  router.patch('/lots/:id', signedIn, editors, c.update);
  router.delete('/lots/:id', signedIn, editors, c.remove);
  return router;
}
