import { DEFAULT_PAGE_SIZE, LENGTH_UNIT_OF, MAX_PAGE_SIZE, cmToLength } from '@rhotrace/api-types';
import { z, type ZodRawShape } from 'zod';
import { paginationSchema } from './validate';

/** Longest values the API accepts for common kinds of text. */
export const LIMITS = { code: 64, name: 200, notes: 5000, search: 200 } as const;

/** An unpaired UTF-16 surrogate: not a character, and not storable in utf8mb4. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Text of whole Unicode characters (no broken surrogate halves). */
const unicodeText = () =>
  z
    .string({ required_error: 'is required', invalid_type_error: 'must be text' })
    .refine((v) => !LONE_SURROGATE.test(v), 'must be valid Unicode text');

/** Required text: trimmed of nothing (stored verbatim), not blank, at most `max` characters. */
export const requiredText = (max: number) =>
  unicodeText()
    .refine((v) => v.length <= max, `must be at most ${max} characters`)
    .refine((v) => v.trim().length > 0, 'must not be blank');

/** Optional text that may be null; an empty string is stored as null. */
export const optionalText = (max: number) =>
  unicodeText()
    .refine((v) => v.length <= max, `must be at most ${max} characters`)
    .nullable()
    .optional()
    .transform((v) => (v === '' ? null : v));

/** A finite number within [min, max] (inclusive), named with its unit in the message. */
export const boundedNumber = (min: number, max: number, unit = '') =>
  z
    .number({ required_error: 'is required', invalid_type_error: 'must be a number' })
    .finite('must be a finite number')
    .min(min, `must be at least ${min}${unit ? ` ${unit}` : ''}`)
    .max(max, `must be at most ${max}${unit ? ` ${unit}` : ''}`);

/**
 * A length stored in cm, between `min` and `max` cm, refused in words that also give the limit
 * in the unit the field is typed in (`LENGTH_UNIT_OF`): "must be at most 50 cm (500 mm)".
 */
export const boundedLength = (min: number, max: number, field: string) => {
  const unit = LENGTH_UNIT_OF[field];
  const limit = (cm: number) => (unit ? `${cm} cm (${cmToLength(cm, unit)} ${unit})` : `${cm} cm`);
  return z
    .number({ required_error: 'is required', invalid_type_error: 'must be a number' })
    .finite('must be a finite number')
    .min(min, `must be at least ${limit(min)}`)
    .max(max, `must be at most ${limit(max)}`);
};

/** True for a real calendar day written YYYY-MM-DD (2024-02-30 is refused). */
export function isIsoDate(value: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const date = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === value;
}

/** An ISO calendar date `YYYY-MM-DD`. */
export const isoDate = z
  .string({ required_error: 'is required', invalid_type_error: 'must be a date YYYY-MM-DD' })
  .refine(isIsoDate, 'must be a real date written YYYY-MM-DD');

/**
 * The query schema of a list: `page`, `pageSize` (capped), `sort` (`field` ascending, `-field`
 * descending, only the listed fields) plus the list's own filters. Unknown parameters are a 400.
 */
export function listQuerySchema<F extends string, S extends ZodRawShape>(
  sortFields: readonly [F, ...F[]],
  filters: S,
) {
  const sortValues = sortFields.flatMap((f) => [f, `-${f}`]) as [string, ...string[]];
  return z
    .object({
      ...paginationSchema(MAX_PAGE_SIZE, DEFAULT_PAGE_SIZE),
      sort: z
        .enum(sortValues, {
          errorMap: () => ({ message: `must be one of ${sortValues.join(', ')}` }),
        })
        .optional(),
      ...filters,
    })
    .strict();
}

/** A `q` search parameter: short text, matched as a substring (LIKE wildcards escaped). */
export const searchParam = z
  .string({ invalid_type_error: 'must be text' })
  .max(LIMITS.search, `must be at most ${LIMITS.search} characters`)
  .optional();

/** `true`/`false` in a query string. */
export const booleanParam = z
  .enum(['true', 'false'], { errorMap: () => ({ message: 'must be true or false' }) })
  .transform((v) => v === 'true')
  .optional();
