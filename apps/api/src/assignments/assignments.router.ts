import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { assignmentsController } from './assignments.controller';

/**
 * /api/assignments: `assignments:assign` assigns; everyone lists (without
 * `assignments:see-all` only their own);
 * the assignee moves their own forward.
 */
export function assignmentsRouter(deps: AppDeps): Router {
  const router = Router();
  const c = assignmentsController(deps);
  const signedIn = authenticate(deps.config.jwtSecret);
  router.get('/assignments/overdue', signedIn, requireCapability('assignments:assign'), c.overdue);
  router.get('/assignments', signedIn, c.list);
  router.post('/assignments', signedIn, requireCapability('assignments:assign'), c.create);
  router.get('/assignments/:id', signedIn, c.get);
  router.patch('/assignments/:id', signedIn, c.update);
  return router;
}
