import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { AppDeps } from '../deps';
import { badRequest } from '../errors';
import { authenticate } from '../middleware/authenticate';
import { sweepsController as c } from './sweep.controller';

/** The upload paths (under /api), the only ones that take multipart/form-data bodies. */
export const SWEEP_UPLOAD_PATHS = /^\/wafers\/[^/]+\/sweeps(?:\/preview)?\/?$/i;

/** Text fields an upload may carry besides the file (method, station, mapping, geometry). */
const MAX_FIELDS = 12;

/** Sweep import and reads. Uploads are buffered only after the wafer check passes. */
export function sweepRouter(deps: AppDeps): Router {
  const router = Router();
  const auth = authenticate(deps.config.jwtSecret);
  const readUpload = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: deps.config.uploadLimitBytes,
      files: 1,
      fields: MAX_FIELDS,
      fieldSize: 256 * 1024,
    },
  }).single('file');
  // Busboy's own errors (a cut-short or malformed multipart body) carry no status: a 400.
  const upload: RequestHandler = (req, res, next) =>
    readUpload(req, res, (error?: unknown) => {
      if (!error || error instanceof multer.MulterError) next(error);
      else next(badRequest(`The upload could not be read: ${(error as Error).message}`));
    });
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
