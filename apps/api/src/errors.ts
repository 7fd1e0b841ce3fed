import { ERROR_STATUS, type ErrorCode, type FieldProblem } from '@rhotrace/api-types';

/** An error that maps to an HTTP status and the API's error shape. */
export class HttpError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: FieldProblem[] | Record<string, unknown>,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.status = ERROR_STATUS[code];
  }
}

export const badRequest = (message: string, details?: FieldProblem[]) =>
  new HttpError('bad_request', message, details);
export const validationFailed = (message: string, details: FieldProblem[]) =>
  new HttpError('validation_failed', message, details);
export const notFound = (what: string) => new HttpError('not_found', `${what} was not found`);
export const forbidden = (message = 'Your role may not do this') =>
  new HttpError('forbidden', message);
export const conflict = (message: string, details?: Record<string, unknown>) =>
  new HttpError('conflict', message, details);
export const unauthenticated = (message = 'Sign in to continue') =>
  new HttpError('unauthenticated', message);
export const unprocessable = (message: string, details?: FieldProblem[]) =>
  new HttpError('unprocessable', message, details);
/** 503 with `Retry-After`: a service the request needs does not answer right now. */
export const serviceUnavailable = (message: string, retryAfterS = 5) =>
  new HttpError('unavailable', message, undefined, { 'Retry-After': String(retryAfterS) });

/**
 * Re-labels a 404 so it names the record the caller asked for (a hidden wafer answers as the
 * sweep or fit on it, so existence does not leak); any other error, a lost database connection
 * above all, passes through unchanged.
 */
export function asNotFound(error: unknown, what: string): unknown {
  return error instanceof HttpError && error.code === 'not_found' ? notFound(what) : error;
}
