import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate, requireRole } from '../middleware/authenticate';
import { auditController as c } from './audit.controller';

/** /api/audit: the trail, for admins and managers. */
export function auditRouter(deps: AppDeps): Router {
  const router = Router();
  router.get(
    '/audit',
    authenticate(deps.config.jwtSecret),
    requireRole('admin', 'manager'),
    c.list,
  );
  return router;
}
