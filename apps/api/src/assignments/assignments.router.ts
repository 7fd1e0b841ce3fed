import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate, requireRole } from '../middleware/authenticate';
import { assignmentsController } from './assignments.controller';
import { ASSIGNERS } from './assignments.service';

/**
 * /api/assignments: admins and managers assign; everyone lists (technicians only their own);
 * the assignee moves their own forward.
 */
export function assignmentsRouter(deps: AppDeps): Router {
  const router = Router();
  const c = assignmentsController(deps);
  const signedIn = authenticate(deps.config.jwtSecret);
  router.get('/assignments/overdue', signedIn, requireRole(...ASSIGNERS), c.overdue);
  router.get('/assignments', signedIn, c.list);
  router.post('/assignments', signedIn, requireRole(...ASSIGNERS), c.create);
  router.get('/assignments/:id', signedIn, c.get);
  router.patch('/assignments/:id', signedIn, c.update);
  return router;
}
