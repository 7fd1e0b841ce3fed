import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { auditController as c } from './audit.controller';

/**
 * /api/audit: the whole trail, for `audit:read`; `/api/{lots,wafers,stations}/:id/history`: one
 * record's trail for anyone who may see the record.
 */
export function auditRouter(deps: AppDeps): Router {
  const router = Router();
  router.get(
    '/audit',
    authenticate(deps.config.jwtSecret),
    requireCapability('audit:read'),
    c.list,
  );
  const signedIn = authenticate(deps.config.jwtSecret);
  router.get('/lots/:id/history', signedIn, c.lotHistory);
  router.get('/wafers/:id/history', signedIn, c.waferHistory);
  router.get('/stations/:id/history', signedIn, c.stationHistory);
  return router;
}
