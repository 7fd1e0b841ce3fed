import { MATERIALS, WAFER_SORT_FIELDS, WAFER_STATES } from '@rhotrace/api-types';
import { z } from 'zod';
import {
  boundedLength,
  LIMITS,
  listQuerySchema,
  optionalText,
  searchParam,
} from '../middleware/fields';
import { idParam } from '../middleware/validate';

export const state = z.enum(WAFER_STATES, {
  errorMap: () => ({ message: `must be one of ${WAFER_STATES.join(', ')}` }),
});

/** A wafer's number in its lot: text up to 32 characters (a whole number is taken as text). */
export const waferNumber = z
  .union(
    [
      z.string().max(32, 'must be at most 32 characters'),
      z.number().int().positive().max(1e9).transform(String),
    ],
    {
      errorMap: (_issue, ctx) => ({
        message:
          ctx.data === undefined
            ? 'is required'
            : 'must be text of at most 32 characters or a whole number',
      }),
    },
  )
  .refine((v) => v.trim().length > 0, 'must not be blank');

export const fields = {
  number: waferNumber,
  thicknessCm: boundedLength(1e-7, 1, 'thicknessCm').nullable(),
  state,
  notes: optionalText(LIMITS.notes),
};

export const createBody = z
  .object({
    number: fields.number,
    thicknessCm: fields.thicknessCm.optional().default(null),
    state: fields.state.optional(),
    notes: fields.notes.transform((v) => v ?? null),
  })
  .strict();

export const updateBody = z
  .object({
    ...fields,
    countedSweepId: z
      .number({ invalid_type_error: 'must be a sweep id or null' })
      .int('must be a sweep id or null')
      .positive('must be a sweep id or null')
      .nullable(),
  })
  .partial()
  .strict();

export const filters = { q: searchParam, state: state.optional() };

export const listQuery = listQuerySchema(WAFER_SORT_FIELDS, {
  ...filters,
  lotId: idParam.optional(),
  material: z
    .enum(MATERIALS, { errorMap: () => ({ message: `must be one of ${MATERIALS.join(', ')}` }) })
    .optional(),
});

export const lotListQuery = listQuerySchema(WAFER_SORT_FIELDS, filters);
