import { Router } from 'express';
import type { AppDeps } from './deps';
import { healthRouter } from './health/health.router';

/**
 * Every API router, mounted under /api. Each feature adds its own line here.
 */
export function apiRoutes(deps: AppDeps): Router {
  const router = Router();
  router.use(healthRouter(deps.sequelize));
  return router;
}
