import type { RequestHandler } from 'express';
import { HttpError } from '../errors';

/** Methods whose request body the API never reads. */
const BODYLESS = new Set(['GET', 'HEAD', 'OPTIONS']);

function hasBody(headers: Record<string, string | string[] | undefined>): boolean {
  const length = headers['content-length'];
  return headers['transfer-encoding'] !== undefined || (length !== undefined && length !== '0');
}

/**
 * Answers 415 for a request body of the wrong type: JSON everywhere, multipart/form-data only on
 * the paths `multipartPaths` matches (relative to the mount point). Bodiless requests pass.
 */
export function requireBodyType(multipartPaths: RegExp): RequestHandler {
  return (req, _res, next) => {
    if (BODYLESS.has(req.method) || !hasBody(req.headers)) {
      next();
      return;
    }
    const multipart = multipartPaths.test(req.path);
    if (req.is(multipart ? 'multipart/form-data' : 'application/json')) {
      next();
      return;
    }
    const sent = req.headers['content-type'] || 'no Content-Type';
    next(
      new HttpError(
        'unsupported_media_type',
        multipart
          ? `Send the sweep as multipart/form-data with the file in the field "file" (got ${sent})`
          : `Send the request body as JSON with Content-Type: application/json (got ${sent})`,
      ),
    );
  };
}
