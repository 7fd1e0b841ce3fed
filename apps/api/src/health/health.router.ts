import { Router } from 'express';
import type { AppDeps } from '../deps';
import { healthController } from './health.controller';

/** `GET /api/health`: 200 with the database up, 503 with it down. No sign-in needed. */
export function healthRouter(deps: Pick<AppDeps, 'sequelize'>): Router {
  const router = Router();
  router.get('/health', healthController(deps).health);
  return router;
}
