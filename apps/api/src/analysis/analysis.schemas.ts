import { MATERIALS } from '@rhotrace/api-types';
import { z } from 'zod';

const positiveDensity = z
  .number({ invalid_type_error: 'must be a number' })
  .finite('must be finite')
  .min(0, 'must be 0 or more')
  .max(1e22, 'must be at most 1e22 cm^-3');
const level = z
  .number({ invalid_type_error: 'must be a number' })
  .gt(0, 'must be above 0 eV')
  .max(1, 'must be at most 1 eV');

/** Doping as the request gives it (densities cm^-3, levels eV). */
export const dopingSchema = z
  .object({
    donorDensity: positiveDensity,
    acceptorDensity: positiveDensity,
    donorLevel: level.optional(),
    acceptorLevel: level.optional(),
    donor: z.string().max(8).optional(),
    acceptor: z.string().max(8).optional(),
  })
  .strict();

const temperature = (name: string) =>
  z
    .number({ required_error: 'is required', invalid_type_error: 'must be a number' })
    .finite('must be finite')
    .min(1, `${name} must be at least 1 K`)
    .max(1500, `${name} must be at most 1500 K`);

/** Body of `POST /api/model/curve`. */
export const curveSchema = z
  .object({
    material: z.enum(MATERIALS, {
      errorMap: () => ({ message: `must be one of ${MATERIALS.join(', ')}` }),
    }),
    doping: dopingSchema.optional(),
    mobilityScale: z
      .number({ invalid_type_error: 'must be a number' })
      .gt(0, 'must be above 0')
      .max(1e6, 'must be at most 1e6')
      .optional(),
    fromK: temperature('fromK'),
    toK: temperature('toK'),
    steps: z
      .number({ required_error: 'is required', invalid_type_error: 'must be a number' })
      .int('must be a whole number')
      .min(2, 'must be at least 2')
      .max(2000, 'must be at most 2000'),
  })
  .strict()
  .refine((b) => b.fromK < b.toK, { message: 'must be above fromK', path: ['toK'] });

/** Query of `GET /api/compare`. */
export const compareSchema = z.object({
  sweeps: z.string({ required_error: 'is required' }).min(1, 'is required'),
  points: z.coerce.number().int('must be a whole number').min(2).max(2000).default(200),
});

/** A ramp leg in a request: its number, or `all` (see `FitRequestOptions.leg`). */
export const legSchema = z.union([
  z.literal('all'),
  z.coerce
    .number({ invalid_type_error: 'must be a leg number or all' })
    .int('must be a whole leg number')
    .positive('must be a leg number (1, 2, ...) or all'),
]);

/**
 * `GET /api/sweeps/:id/analysis` query: `leg` picks a ramp leg (or `all`); on a map sweep,
 * `site` names one site (its label, or `x,y` in mm); without it the map mean is analysed.
 */
export const analysisQuerySchema = z
  .object({
    leg: legSchema.optional(),
    site: z.string().trim().min(1, 'must name a site').max(64).optional(),
  })
  .passthrough();
