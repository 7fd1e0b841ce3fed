import { Router } from 'express';
import { requireCapability } from '../access/require-capability';
import type { AppDeps } from '../deps';
import { authenticate } from '../middleware/authenticate';
import { importSettingsController as c } from './import-settings.controller';

/**
 * /api/import-settings: whoever uploads reads and saves them (a saved setting only presets a
 * later upload, which its uploader still sees and may change); those who edit stations delete.
 */
export function importSettingsRouter(deps: AppDeps): Router {
  const router = Router();
  const signedIn = authenticate(deps.config.jwtSecret);
  router.get('/import-settings', signedIn, requireCapability('sweeps:upload'), c.list);
  router.put('/import-settings', signedIn, requireCapability('sweeps:upload'), c.save);
  router.delete('/import-settings/:id', signedIn, requireCapability('stations:edit'), c.remove);
  return router;
}
