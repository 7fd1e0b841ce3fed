import type { FieldProblem } from '@rhotrace/api-types';
import { z, type ZodTypeAny } from 'zod';
import { validationFailed } from '../errors';

/** Converts zod issues into the API's `{ field, problem }` list. */
export function problemsOf(error: z.ZodError, prefix: string): FieldProblem[] {
  return error.issues.flatMap((issue) => {
    const at = [prefix, ...issue.path.map(String)].filter(Boolean);
    // Name each unknown field on its own, so a client sees exactly what to remove.
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map((key) => ({
        field: [...at, key].join('.'),
        problem: 'is not a known field',
      }));
    }
    return [{ field: at.join('.'), problem: issue.message }];
  });
}

/** Parses `value` with `schema` or throws a 400 naming each bad field under `prefix`. */
export function parseOrThrow<S extends ZodTypeAny>(
  schema: S,
  value: unknown,
  prefix: 'body' | 'query' | 'params' | string,
): z.infer<S> {
  const result = schema.safeParse(value ?? {});
  if (!result.success) {
    throw validationFailed(`Some ${prefix} fields are not valid`, problemsOf(result.error, prefix));
  }
  return result.data as z.infer<S>;
}

/**
 * A positive integer id from a path or query parameter (`/lots/abc` is a 400, not a 500). Text
 * must be plain digits: `1e3`, `0x10`, `1.0` and ` 7` are refused, not read as numbers.
 */
export const idParam = z.preprocess(
  (v) => (typeof v === 'string' && !/^-?\d+$/.test(v) ? Number.NaN : v),
  z.coerce
    .number({ invalid_type_error: 'must be a whole number' })
    .int('must be a whole number')
    .positive('must be positive')
    .max(2_147_483_647, 'is too large'),
);

/** Parses `req.params.id` (or another named parameter) as an id. */
export function parseId(params: Record<string, unknown>, name = 'id'): number {
  return parseOrThrow(z.object({ [name]: idParam }), params, 'params')[name] as number;
}

/** Shared pagination query: `page` from 1, `pageSize` capped. */
export function paginationSchema(maxPageSize: number, defaultPageSize: number) {
  return {
    page: z.coerce.number().int().min(1).max(1_000_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(maxPageSize).default(defaultPageSize),
  };
}
