import { LOT_SORT_FIELDS, MATERIALS, METAL_FILMS } from '@rhotrace/api-types';
import { z } from 'zod';
import {
  boundedLength,
  boundedNumber,
  isoDate,
  LIMITS,
  listQuerySchema,
  optionalText,
  requiredText,
  searchParam,
} from '../middleware/fields';

const material = z.enum(MATERIALS, {
  errorMap: () => ({ message: `must be one of ${MATERIALS.join(', ')}` }),
});
const dopantType = z.enum(['n', 'p'], { errorMap: () => ({ message: 'must be n or p' }) });
const ohmCm = boundedNumber(1e-12, 1e12, 'Ω·cm').refine((v) => v > 0, 'must be positive');

/** Every field of a lot, each optional (PATCH); `lotCreateBody` makes code and material required. */
const lotFields = {
  code: requiredText(LIMITS.code),
  material,
  dopant: z
    .string({ invalid_type_error: 'must be text' })
    .regex(/^[A-Z][a-z]?$/, 'must be an element symbol such as B, P, As or Sb')
    .nullable(),
  dopantType: dopantType.nullable(),
  orientation: optionalText(16),
  diameterCm: boundedLength(0.5, 50, 'diameterCm').nullable(),
  thicknessCm: boundedLength(1e-7, 1, 'thicknessCm').nullable(),
  /** +/- half-width; read by the uncertainty of the 23 °C values. */
  thicknessToleranceCm: boundedLength(0, 0.1, 'thicknessToleranceCm').nullable(),
  supplier: optionalText(LIMITS.name),
  receivedOn: isoDate.nullable(),
  specMinOhmCm: ohmCm.nullable(),
  specMaxOhmCm: ohmCm.nullable(),
  notes: optionalText(LIMITS.notes),
};

const metals: readonly string[] = METAL_FILMS;
const semiconductorOnly = (lot: { material?: string; dopantType?: string | null }) =>
  !(lot.material && metals.includes(lot.material) && lot.dopantType);
const toleranceBelowThickness = (lot: {
  thicknessCm?: number | null;
  thicknessToleranceCm?: number | null;
}) =>
  lot.thicknessCm == null ||
  lot.thicknessToleranceCm == null ||
  lot.thicknessToleranceCm < lot.thicknessCm;
const specOrdered = (lot: { specMinOhmCm?: number | null; specMaxOhmCm?: number | null }) =>
  lot.specMinOhmCm == null || lot.specMaxOhmCm == null || lot.specMinOhmCm <= lot.specMaxOhmCm;

/** `POST /api/lots` body. */
export const lotCreateBody = z
  .object({
    ...lotFields,
    dopant: lotFields.dopant.optional().default(null),
    dopantType: lotFields.dopantType.optional().default(null),
    diameterCm: lotFields.diameterCm.optional().default(null),
    thicknessCm: lotFields.thicknessCm.optional().default(null),
    thicknessToleranceCm: lotFields.thicknessToleranceCm.optional().default(null),
    receivedOn: lotFields.receivedOn.optional().default(null),
    specMinOhmCm: lotFields.specMinOhmCm.optional().default(null),
    specMaxOhmCm: lotFields.specMaxOhmCm.optional().default(null),
  })
  .strict()
  .refine(specOrdered, { path: ['specMinOhmCm'], message: 'must not exceed specMaxOhmCm' })
  .refine(semiconductorOnly, { path: ['dopantType'], message: 'applies to semiconductors only' })
  .refine(toleranceBelowThickness, {
    path: ['thicknessToleranceCm'],
    message: 'must be smaller than thicknessCm',
  })
  .transform((lot) => ({
    ...lot,
    orientation: lot.orientation ?? null,
    supplier: lot.supplier ?? null,
    notes: lot.notes ?? null,
  }));

/** `PATCH /api/lots/:id` body: any subset of the fields. */
export const lotUpdateBody = z
  .object(lotFields)
  .partial()
  .strict()
  .refine(specOrdered, { path: ['specMinOhmCm'], message: 'must not exceed specMaxOhmCm' })
  .refine(semiconductorOnly, { path: ['dopantType'], message: 'applies to semiconductors only' })
  .refine(toleranceBelowThickness, {
    path: ['thicknessToleranceCm'],
    message: 'must be smaller than thicknessCm',
  });

/** `GET /api/lots` query. */
export const lotListQuery = listQuerySchema(LOT_SORT_FIELDS, {
  q: searchParam,
  material: material.optional(),
  dopantType: dopantType.optional(),
});
