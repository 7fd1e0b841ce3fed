import { Router } from 'express';
import type { AppDeps } from '../deps';
import { devMailController } from './dev-mail.controller';

/**
 * /api/dev/mail (never in production): the SMTP stand-in's captured .eml files, newest first, as
 * JSON or, for a browser, a small page; `/api/dev/mail/:file` answers one raw message.
 */
export function devMailRouter(deps: AppDeps): Router {
  const router = Router();
  if (deps.config.production) return router;
  const c = devMailController(deps.config.mailDir);
  router.get('/dev/mail', c.list);
  router.get('/dev/mail/:file', c.get);
  return router;
}
