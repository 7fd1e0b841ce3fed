import { Router } from 'express';
import type { AppDeps } from './deps';
import { healthRouter } from './health/health.router';
import { authRouter } from './auth/auth.router';
import { usersRouter } from './users/users.router';

/**
 * Every API router, mounted under /api. Each feature adds its own line here.
 */
export function apiRoutes(deps: AppDeps): Router {
  const router = Router();
  router.use(healthRouter(deps.sequelize));
  router.use(authRouter(deps));
  router.use(usersRouter(deps));
  return router;
}
