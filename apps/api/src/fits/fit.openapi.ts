import type { FitDto, FitPreviewDto } from '@rhotrace/api-types';
import { FIT_KINDS } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registry, routesOf } from '../openapi/registry';
import { dateTime, fileBody, personRef } from '../openapi/shapes';
import { FIT_KIND_TABLE } from './fit-kinds';

const regime = z.enum(['freeze-out', 'extrinsic', 'intrinsic']);

/** The fields of a fit as it would be stored (the preview's answer). */
const previewShape = {
  sweepId: z.number().int(),
  kind: z.enum(FIT_KINDS),
  inputs: z.record(z.unknown()),
  windowMinK: z.number().nullable(),
  windowMaxK: z.number().nullable(),
  parameters: z.record(z.number()),
  standardErrors: z.record(z.number().nullable()),
  confidenceIntervals: z.record(z.tuple([z.number(), z.number()]).nullable()),
  goodness: z
    .object({
      rSquared: z.number().nullable(),
      count: z.number().int(),
      residualRms: z.number(),
      residualUnit: z.string(),
      degreesOfFreedom: z.number().optional(),
      iterations: z.number().optional(),
      tCritical: z.number().optional(),
      correlation: z
        .object({ parameters: z.array(z.string()), matrix: z.array(z.array(z.number())) })
        .strict()
        .nullable()
        .optional(),
    })
    .passthrough(),
  residuals: z.array(z.object({ temperatureK: z.number(), residual: z.number() }).strict()),
  converged: z.boolean(),
  reason: z.string().nullable(),
  reading: z.string().nullable(),
  stepCount: z.number().int().nullable(),
  excludedSequences: z.array(z.number().int()),
  interpretation: z
    .object({
      regime: regime.nullable(),
      property: z.enum(['band-gap-0K', 'dopant-level']).nullable(),
      valueEv: z.number().nullable(),
      standardErrorEv: z.number().nullable(),
      compensation: z.enum(['compensated', 'uncompensated', 'unknown']),
      compensationSource: z.enum(['request', 'inferred', 'not-applicable']),
      prefactorExponent: z.number(),
      note: z.string(),
      compensationRatio: z
        .object({
          value: z.number(),
          confidenceInterval95: z.tuple([z.number(), z.number()]).nullable(),
        })
        .strict()
        .nullable()
        .optional(),
      // A union with null: zod-to-openapi drops null from a nullable enum.
      scattering: z
        .union([
          z.enum(['acoustic-phonon', 'acoustic-and-optical-phonon', 'ionized-impurity', 'mixed']),
          z.null(),
        ])
        .optional(),
    })
    .strict()
    .nullable(),
  curvature: z
    .object({
      value: z.number(),
      standardError: z.number(),
      t: z.number(),
      significant: z.boolean(),
    })
    .strict()
    .nullable(),
  warnings: z.array(z.string()),
  modelVersion: z.string(),
};

/** The fit as it would be stored (the preview's answer). */
const fitPreviewSchema = z.object(previewShape).strict() satisfies z.ZodType<FitPreviewDto>;

/** A stored fit. */
export const fitSchema = registry.register(
  'Fit',
  z
    .object({ id: z.number().int(), ...previewShape, createdBy: personRef, createdAt: dateTime })
    .strict(),
) satisfies z.ZodType<FitDto>;

/** The request body: one of the kinds of `FIT_KIND_TABLE`, told apart by `kind`. */
const fitRequest = z.union([
  FIT_KIND_TABLE.arrhenius.schema,
  FIT_KIND_TABLE.model.schema,
  FIT_KIND_TABLE.tcr.schema,
  FIT_KIND_TABLE['bloch-gruneisen'].schema,
  FIT_KIND_TABLE['carrier-density'].schema,
  FIT_KIND_TABLE['hall-mobility'].schema,
]);

/** Fits of a sweep. */
export function registerFitsApi(): void {
  const route = routesOf('Fits');
  route({
    method: 'post',
    path: '/sweeps/:id/fits',
    summary: 'Fits a model to a sweep and stores the fit',
    params: idParams,
    body: fitRequest,
    ok: { status: 201, description: 'The stored fit', schema: fitSchema },
    errors: [403, 404, 422],
  });
  route({
    method: 'post',
    path: '/sweeps/:id/fits/preview',
    summary: 'Runs a fit without storing it',
    params: idParams,
    body: fitRequest,
    ok: { status: 200, description: 'The fit as it would be stored', schema: fitPreviewSchema },
    errors: [403, 404, 422],
  });
  route({
    method: 'get',
    path: '/sweeps/:id/fits',
    summary: "A sweep's stored fits",
    params: idParams,
    ok: { status: 200, description: 'The fits', schema: z.array(fitSchema) },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/sweeps/:id/fits.csv',
    summary: "A sweep's fits as CSV, one row per parameter",
    params: idParams,
    ok: { status: 200, description: 'The fits', schema: fileBody, contentType: 'text/csv' },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/fits/:id',
    summary: 'One stored fit',
    params: idParams,
    ok: { status: 200, description: 'The fit', schema: fitSchema },
    errors: [404],
  });
  route({
    method: 'delete',
    path: '/fits/:id',
    summary: 'Deletes a fit',
    params: idParams,
    ok: { status: 204, description: 'Deleted' },
    errors: [403, 404],
  });
}
