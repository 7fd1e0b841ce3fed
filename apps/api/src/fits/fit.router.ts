import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { fitsController } from './fit.controller';

/**
 * Fits: every role may read fits of sweeps it can see; `fits:run` previews (nothing stored) and
 * saves them (403 otherwise); deleting follows `mayDeleteFit`.
 */
export function fitsRouter(deps: AppDeps): Router {
  const router = Router();
  const auth = authenticate(deps.config.jwtSecret);
  const h = fitsController(deps);
  router.post('/sweeps/:id/fits', auth, requireCapability('fits:run'), h.create);
  router.post('/sweeps/:id/fits/preview', auth, requireCapability('fits:run'), h.preview);
  router.get('/sweeps/:id/fits', auth, h.list);
  router.get('/sweeps/:id/fits.csv', auth, h.csv);
  router.get('/fits/:id', auth, h.get);
  router.delete('/fits/:id', auth, h.remove);
  return router;
}
