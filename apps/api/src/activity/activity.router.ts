import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate } from '../middleware/authenticate';
import { activityController as c } from './activity.controller';

/**
 * Recent activity for a bench: `/sweeps/recent` and `/fits/recent`, each limited to what the
 * user may see. Mount it before the routers that own `/sweeps/:id` and `/fits/:id`, so `recent`
 * is never read as an id.
 */
export function activityRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  router.get('/sweeps/recent', signedIn, c.recentSweeps);
  router.get('/fits/recent', signedIn, c.recentFits);
  return router;
}
