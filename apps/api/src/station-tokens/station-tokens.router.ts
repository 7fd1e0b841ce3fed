import { Router } from 'express';
import type { AppDeps } from '../deps';
import { requireCapability } from '../access/require-capability';
import { authenticate } from '../middleware/authenticate';
import { noStore } from '../middleware/no-store';
import { stationTokensController as c } from './station-tokens.controller';

/** /api/stations/:id/tokens: those who edit stations make, list and revoke their tokens. */
export function stationTokensRouter(deps: AppDeps): Router {
  const router = Router();
  const editors = [authenticate(deps.config.jwtSecret), requireCapability('stations:edit')];
  router.get('/stations/:id/tokens', ...editors, c.list);
  // the answer carries the token itself: no cache may keep it
  router.post('/stations/:id/tokens', ...editors, noStore, c.create);
  router.delete('/stations/:id/tokens/:tokenId', ...editors, c.revoke);
  return router;
}
