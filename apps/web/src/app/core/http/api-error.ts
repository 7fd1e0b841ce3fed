import { HttpContext, HttpContextToken, HttpErrorResponse } from '@angular/common/http';
import type { AbstractControl, FormGroup } from '@angular/forms';
import type { ApiErrorBody, FieldProblem } from '@rhotrace/api-types';

/** Requests marked quiet handle their own errors (no snackbar), e.g. forms mapping fields. */
export const QUIET = new HttpContextToken<boolean>(() => false);

/** An HttpContext that marks a request as quiet. */
export function quietRequest(): HttpContext {
  return new HttpContext().set(QUIET, true);
}

/** A failed API request in the shared error shape. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: FieldProblem[] = [],
    readonly raw: Record<string, unknown> | null = null,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

function isErrorBody(value: unknown): value is ApiErrorBody {
  return (
    typeof value === 'object' &&
    value !== null &&
    'error' in value &&
    typeof (value as ApiErrorBody).error?.message === 'string'
  );
}

/** Turns any HttpErrorResponse into an ApiError with a message a person can read. */
export function toApiError(response: HttpErrorResponse): ApiError {
  const body: unknown = response.error;
  if (isErrorBody(body)) {
    const details = Array.isArray(body.error.details) ? body.error.details : [];
    const raw = Array.isArray(body.error.details) ? null : (body.error.details ?? null);
    return new ApiError(response.status, body.error.code, body.error.message, details, raw);
  }
  if (response.status === 0) {
    return new ApiError(0, 'offline', 'The server could not be reached. Check the connection.');
  }
  if (response.status === 413) {
    return new ApiError(413, 'payload_too_large', 'That file is larger than the server accepts.');
  }
  return new ApiError(
    response.status,
    'internal',
    `The server answered ${response.status} ${response.statusText || ''}`.trim(),
  );
}

/** The field name a problem refers to: `body.specMinOhmCm` → `specMinOhmCm`. */
export function fieldOf(problem: FieldProblem): string {
  return problem.field.replace(/^(body|query|params)\./, '');
}

/**
 * Puts the server's field problems on the matching form controls (error key `server`).
 * Returns the problems that matched no control, for showing above the form.
 */
export function applyServerErrors(form: FormGroup, error: ApiError): FieldProblem[] {
  const unmatched: FieldProblem[] = [];
  for (const problem of error.details) {
    const control: AbstractControl | null = form.get(fieldOf(problem));
    if (control) {
      control.setErrors({ ...(control.errors ?? {}), server: problem.problem });
      control.markAsTouched();
    } else {
      unmatched.push(problem);
    }
  }
  return unmatched;
}
