import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '@rhotrace/api-types';
import { BaseError, UniqueConstraintError, ValidationError } from 'sequelize';
import { isDatabaseUnavailable } from '../db/transient-errors';
import { HttpError } from '../errors';

function body(code: string, message: string, details?: unknown): ApiErrorBody {
  return { error: { code, message, ...(details ? { details: details as never } : {}) } };
}

/** Maps every error to `{ error: { code, message, details? } }`; never leaks a stack trace. */
export const errorHandler: ErrorRequestHandler = (error: unknown, req, res, _next) => {
  void _next;
  if (error instanceof HttpError) {
    if (error.headers) res.set(error.headers);
    res.status(error.status).json(body(error.code, error.message, error.details));
    return;
  }
  const e = error as { type?: string; status?: number; statusCode?: number; code?: string };
  // body-parser and multer errors carry their own status
  if (
    e?.type === 'entity.too.large' ||
    e?.code === 'LIMIT_FILE_SIZE' ||
    e?.code === 'LIMIT_FIELD_VALUE'
  ) {
    res
      .status(413)
      .json(body('payload_too_large', 'The request body or file is larger than the limit'));
    return;
  }
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json(body('bad_request', 'The request body is not valid JSON'));
    return;
  }
  if (typeof e?.code === 'string' && e.code.startsWith('LIMIT_')) {
    res.status(400).json(body('bad_request', `Upload refused: ${(error as Error).message}`));
    return;
  }
  const status = e?.status ?? e?.statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    res.status(status).json(body('bad_request', (error as Error).message || 'Bad request'));
    return;
  }
  if (error instanceof UniqueConstraintError) {
    res.status(409).json(body('conflict', 'A record with these values already exists'));
    return;
  }
  if (error instanceof ValidationError) {
    res.status(400).json(
      body(
        'validation_failed',
        'Some fields are not valid',
        error.errors.map((x) => ({ field: x.path ?? '', problem: x.message })),
      ),
    );
    return;
  }
  if (
    isDatabaseUnavailable(error) ||
    (error instanceof BaseError && isDatabaseUnavailable(error))
  ) {
    res.set('Retry-After', '5');
    res
      .status(503)
      .json(body('unavailable', 'The database is not reachable right now; retry in a few seconds'));
    return;
  }
  (res as { err?: unknown }).err = error;
  req.log?.error({ err: error }, 'unhandled error');
  res.status(500).json(body('internal', 'Something went wrong on the server; it has been logged'));
};

/** The JSON 404 for unknown API paths. */
export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json(body('not_found', `No API route ${req.method} ${req.path}`));
};
