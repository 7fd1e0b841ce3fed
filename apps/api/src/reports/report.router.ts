import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate } from '../middleware/authenticate';
import { reportsController as c } from './report.controller';

/**
 * The printable PDF reports: `GET /api/sweeps/:id/report` (one sweep) and
 * `GET /api/lots/:id/report.pdf` (one lot), for any role that sees the record.
 */
export function reportsRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/sweeps/:id/report', authenticate(deps.config.jwtSecret), c.sweepReport);
  router.get('/lots/:id/report.pdf', authenticate(deps.config.jwtSecret), c.lotReport);
  return router;
}
