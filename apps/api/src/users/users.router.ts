import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate, requireRole } from '../middleware/authenticate';
import { usersController as c } from './users.controller';

/** /api/users: account management for admins; `/users/assignees` also for managers. */
export function usersRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  const admin = requireRole('admin');
  router.get('/users/assignees', signedIn, requireRole('admin', 'manager'), c.assignees);
  router.get('/users', signedIn, admin, c.list);
  router.post('/users', signedIn, admin, c.create);
  router.get('/users/:id', signedIn, admin, c.get);
  router.patch('/users/:id', signedIn, admin, c.update);
  return router;
}
