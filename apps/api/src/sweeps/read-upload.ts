import type { RequestHandler } from 'express';
import multer from 'multer';
import type { AppConfig } from '../config';
import { badRequest } from '../errors';

/** Text fields an upload may carry besides the file (method, station, mapping, geometry). */
const MAX_FIELDS = 12;

/**
 * Reads a multipart upload (one file in the field `file`, in memory, within the configured
 * size). Busboy's own errors (a cut-short or malformed body) carry no status: they become 400.
 */
export function readUpload(config: Pick<AppConfig, 'uploadLimitBytes'>): RequestHandler {
  const read = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: config.uploadLimitBytes,
      files: 1,
      fields: MAX_FIELDS,
      fieldSize: 256 * 1024,
    },
  }).single('file');
  return (req, res, next) =>
    read(req, res, (error?: unknown) => {
      if (!error || error instanceof multer.MulterError) next(error);
      else next(badRequest(`The upload could not be read: ${(error as Error).message}`));
    });
}
