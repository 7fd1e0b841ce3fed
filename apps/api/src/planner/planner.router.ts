import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { postPlan } from './planner.controller';

/** /api/planner: `plans:make` computes a measurement plan (nothing is stored). */
export function plannerRouter(deps: AppDeps): Router {
  const router = Router();
  router.post(
    '/planner',
    authenticate(deps.config.jwtSecret),
    requireCapability('plans:make'),
    postPlan,
  );
  return router;
}
