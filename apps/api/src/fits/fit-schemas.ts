import { FIT_KINDS } from '@rhotrace/api-types';
import { z } from 'zod';
import { legSchema } from '../analysis/analysis.schemas';

/** A temperature in a fit request, K. */
export const kelvin = z
  .number({ required_error: 'is required', invalid_type_error: 'must be a number' })
  .finite('must be finite')
  .positive('must be positive (kelvin)')
  .max(1500, 'must be at most 1500 K');

/** Fields every fit request takes (see `FitRequestOptions`). */
export const fitOptionsShape = {
  includeFlagged: z.boolean({ invalid_type_error: 'must be true or false' }).optional(),
  leg: legSchema.optional(),
  stepToleranceK: z
    .number({ invalid_type_error: 'must be a number' })
    .finite('must be finite')
    .min(0, 'must be at least 0 K')
    .max(20, 'must be at most 20 K')
    .optional(),
  temperatureUncertaintyK: z
    .number({ invalid_type_error: 'must be a number' })
    .finite('must be finite')
    .min(0, 'must be at least 0 K')
    .max(50, 'must be at most 50 K')
    .optional(),
  site: z
    .string()
    .trim()
    .min(1, 'must name a site')
    .max(64, 'must be at most 64 characters')
    .optional(),
};

/** Refuses minK >= maxK, naming maxK. */
export function boundsInOrder<T extends { minK?: number; maxK?: number }>(
  schema: z.ZodType<T, z.ZodTypeDef, unknown>,
): z.ZodType<T, z.ZodTypeDef, unknown> {
  return schema.refine((b) => b.minK === undefined || b.maxK === undefined || b.minK < b.maxK, {
    message: 'must be above minK (the bounds are reversed or equal)',
    path: ['maxK'],
  });
}

/** The kind alone, checked first so each kind's own schema reads the rest. */
export const fitKindSchema = z
  .object({
    kind: z.enum(FIT_KINDS, {
      errorMap: () => ({ message: `must be one of ${FIT_KINDS.join(', ')}` }),
    }),
  })
  .passthrough();

/** The parameters a fit frees, from `names`: at least one, none twice. */
export function freeParameters<T extends readonly [string, ...string[]]>(names: T) {
  return z
    .array(z.enum(names))
    .min(1, 'must free at least one parameter')
    .refine((a) => new Set(a).size === a.length, 'must not repeat a parameter');
}
