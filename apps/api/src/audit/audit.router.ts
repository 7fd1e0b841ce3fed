import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { auditController as c } from './audit.controller';

/** /api/audit: the trail, for `audit:read`. */
export function auditRouter(deps: AppDeps): Router {
  const router = Router();
  router.get(
    '/audit',
    authenticate(deps.config.jwtSecret),
    requireCapability('audit:read'),
    c.list,
  );
  return router;
}
