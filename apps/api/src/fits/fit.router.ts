import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate, requireRole } from '../middleware/authenticate';
import { fitHandlers } from './fit.controller';

/**
 * Fits: every role may read fits of sweeps it can see; admins, managers, engineers and
 * physicists preview (nothing stored) and save them (technicians 403); deleting follows
 * `deleteFit`'s rules.
 */
export function fitsRouter(deps: AppDeps): Router {
  const router = Router();
  const auth = authenticate(deps.config.jwtSecret);
  const h = fitHandlers(deps);
  router.post(
    '/sweeps/:id/fits',
    auth,
    requireRole('admin', 'manager', 'engineer', 'physicist'),
    h.create,
  );
  router.post(
    '/sweeps/:id/fits/preview',
    auth,
    requireRole('admin', 'manager', 'engineer', 'physicist'),
    h.preview,
  );
  router.get('/sweeps/:id/fits', auth, h.list);
  router.get('/sweeps/:id/fits.csv', auth, h.csv);
  router.get('/fits/:id', auth, h.get);
  router.delete('/fits/:id', auth, h.remove);
  return router;
}
