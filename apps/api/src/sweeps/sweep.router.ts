import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate } from '../middleware/authenticate';
import { readUpload } from './read-upload';
import { sweepsController as c } from './sweep.controller';

/**
 * The upload paths (under /api), the only ones that take multipart/form-data bodies: a user's
 * upload and its preview, and a station's post.
 */
export const SWEEP_UPLOAD_PATHS =
  /^(?:\/wafers\/[^/]+\/sweeps(?:\/preview)?|\/station\/sweeps)\/?$/i;

/** Sweep import and reads. Uploads are buffered only after the wafer check passes. */
export function sweepRouter(deps: AppDeps): Router {
  const router = Router();
  const auth = authenticate(deps.config.jwtSecret);
  const upload = readUpload(deps.config);
  // Checked before the body is read, so a hidden wafer costs no upload.
  const waferVisible = c.checkUploadTarget;
  router.post('/wafers/:id/sweeps/preview', auth, waferVisible, upload, c.preview);
  router.post('/wafers/:id/sweeps', auth, waferVisible, upload, c.store);
  router.get('/wafers/:id/sweeps', auth, c.list);
  router.get('/sweeps/:id', auth, c.get);
  router.get('/sweeps/:id/points.csv', auth, c.pointsCsv);
  router.get('/sweeps/:id/raw', auth, c.raw);
  router.delete('/sweeps/:id', auth, c.remove);
  return router;
}
