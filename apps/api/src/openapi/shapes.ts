/** Response shapes several resources share. */
import { z, type ZodTypeAny } from 'zod';

/** An ISO 8601 date-time as the API writes it (`2026-01-31T12:00:00.000Z`). */
export const dateTime = z.string().datetime({ offset: true });

/** `createdAt` and `updatedAt`. */
export const timestamps = { createdAt: dateTime, updatedAt: dateTime };

/** A page of a list: `{ items, total, page, pageSize }`. */
export function pageOf<T extends ZodTypeAny>(item: T) {
  return z
    .object({
      items: z.array(item),
      total: z.number().int().min(0),
      page: z.number().int().min(1),
      pageSize: z.number().int().min(1),
    })
    .strict();
}

/** `{ items }` without paging. */
export function itemsOf<T extends ZodTypeAny>(item: T) {
  return z.object({ items: z.array(item) }).strict();
}

/** `{ id, name }` of the person who did something (name null for a deleted account). */
export const personRef = z.object({ id: z.number().int(), name: z.string().nullable() }).strict();

/** A file answer (CSV, PDF, raw upload). */
export const fileBody = z.string().describe('The file itself');

/** Any JSON value (a stored snapshot, a parameter set). */
export const jsonValue = z.union([
  z.record(z.unknown()),
  z.array(z.unknown()),
  z.string(),
  z.number(),
  z.boolean(),
  z.null(),
]);

const GEOMETRY_KEYS = ['thicknessCm', 'diameterCm', 'spacingCm', 'barLengthCm', 'barWidthCm'];
const geometrySource = z.enum(['request', 'wafer', 'lot', 'station', 'file']);
/** The geometry a sweep was converted with (`SweepGeometry`). */
export const sweepGeometry = z
  .object({
    thicknessCm: z.number().optional(),
    diameterCm: z.number().optional(),
    spacingCm: z.number().optional(),
    barLengthCm: z.number().optional(),
    barWidthCm: z.number().optional(),
    rtdR0Ohm: z.number().optional(),
    sources: z
      .object(Object.fromEntries([...GEOMETRY_KEYS, 'rtdR0Ohm'].map((k) => [k, geometrySource])))
      .partial()
      .strict(),
  })
  .strict();
