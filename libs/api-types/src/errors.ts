/** One problem with one field of a request, as `{ field, problem }`. */
export interface FieldProblem {
  /** Dotted path of the field (`body.code`, `query.page`, `row 12, column T (K)`). */
  field: string;
  problem: string;
}

/** The error shape every failed API request answers with. */
export interface ApiErrorBody {
  error: {
    /** Stable machine-readable code, e.g. `validation_failed`, `not_found`, `conflict`. */
    code: string;
    message: string;
    details?: FieldProblem[] | Record<string, unknown>;
  };
}

/** Error codes the API uses, with the HTTP status each one maps to. */
export const ERROR_STATUS = {
  bad_request: 400,
  validation_failed: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  too_many_requests: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;
