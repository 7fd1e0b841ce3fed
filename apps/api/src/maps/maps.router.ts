import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate } from '../middleware/authenticate';
import { mapsController } from './maps.controller';

/**
 * Wafer maps: a map sweep's maps at each temperature and a lot's maps on one scale. Every
 * signed-in role may read them, limited to the wafers the user may see (404 otherwise).
 */
export function mapsRouter(deps: AppDeps): Router {
  const router = Router();
  const auth = authenticate(deps.config.jwtSecret);
  router.get('/sweeps/:id/map', auth, mapsController.sweep);
  router.get('/sweeps/:id/map.csv', auth, mapsController.sweepCsv);
  router.get('/lots/:id/maps', auth, mapsController.lot);
  return router;
}
