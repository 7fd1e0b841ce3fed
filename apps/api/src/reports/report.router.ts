import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate } from '../middleware/authenticate';
import { reportsController as c } from './report.controller';

/** `GET /api/sweeps/:id/report`: the printable PDF report of one sweep (any role that sees it). */
export function reportsRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/sweeps/:id/report', authenticate(deps.config.jwtSecret), c.sweepReport);
  return router;
}
