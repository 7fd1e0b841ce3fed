import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { usersController as c } from './users.controller';

/** /api/users: account management (`users:manage`); `/users/assignees` for those who assign. */
export function usersRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  const admin = requireCapability('users:manage');
  router.get('/users/assignees', signedIn, requireCapability('assignments:assign'), c.assignees);
  router.get('/users', signedIn, admin, c.list);
  router.post('/users', signedIn, admin, c.create);
  router.get('/users/:id', signedIn, admin, c.get);
  router.patch('/users/:id', signedIn, admin, c.update);
  return router;
}
