import type { Request, Response } from 'express';
import type { FitRequest } from '@rhotrace/api-types';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { dopingSchema } from '../analysis/analysis.controller';
import { toCsv } from '../analysis/csv';
import { currentUser } from '../middleware/authenticate';
import { parseId, parseOrThrow } from '../middleware/validate';
import { MODEL_FREE_PARAMETERS } from './fit-kinds';
import { createFit, deleteFit, getFit, previewFit, sweepFits } from './fit.service';

const kelvin = z
  .number({ required_error: 'is required', invalid_type_error: 'must be a number' })
  .finite('must be finite')
  .positive('must be positive (kelvin)')
  .max(1500, 'must be at most 1500 K');

const reversed = (b: { minK?: number; maxK?: number }) =>
  b.minK === undefined || b.maxK === undefined || b.minK < b.maxK;
const reversedIssue = {
  message: 'must be above minK (the bounds are reversed or equal)',
  path: ['maxK'],
};

const arrheniusSchema = z
  .object({
    kind: z.literal('arrhenius'),
    minK: kelvin,
    maxK: kelvin,
    quantity: z.enum(['resistivity', 'conductivity']).optional(),
    prefactorExponent: z
      .number()
      .finite()
      .min(-5, 'must be at least -5')
      .max(5, 'must be at most 5')
      .optional(),
    regime: z.enum(['freeze-out', 'extrinsic', 'intrinsic']).optional(),
    compensated: z.boolean().optional(),
  })
  .strict();
const modelSchema = z
  .object({
    kind: z.literal('model'),
    material: z.string().max(16).optional(),
    initial: dopingSchema.extend({
      mobilityScale: z.number().positive('must be positive').max(100).optional(),
    }),
    free: z
      .array(z.enum(MODEL_FREE_PARAMETERS))
      .min(1, 'must free at least one parameter')
      .refine((a) => new Set(a).size === a.length, 'must not repeat a parameter'),
    minK: kelvin.optional(),
    maxK: kelvin.optional(),
  })
  .strict();
const tcrSchema = z
  .object({
    kind: z.literal('tcr'),
    referenceK: kelvin.optional(),
    minK: kelvin.optional(),
    maxK: kelvin.optional(),
  })
  .strict();
const bgSchema = z
  .object({ kind: z.literal('bloch-gruneisen'), minK: kelvin.optional(), maxK: kelvin.optional() })
  .strict();

const fitSchema = z
  .discriminatedUnion('kind', [arrheniusSchema, modelSchema, tcrSchema, bgSchema], {
    errorMap: (issue, ctx) =>
      issue.code === 'invalid_union_discriminator'
        ? { message: 'must be one of arrhenius, model, tcr, bloch-gruneisen' }
        : { message: ctx.defaultError },
  })
  .refine(reversed, reversedIssue);

/** Route handlers for fits. */
export function fitHandlers(deps: AppDeps) {
  const actor = (req: Request) => ({
    id: currentUser(req).id,
    requestId: String(req.id ?? '') || null,
  });
  return {
    /** `POST /api/sweeps/:id/fits` → 201 with the stored fit. */
    async create(req: Request, res: Response): Promise<void> {
      const sweepId = parseId(req.params);
      const body = parseOrThrow(fitSchema, req.body, 'body') as FitRequest;
      res
        .status(201)
        .json(await createFit(deps.sequelize, currentUser(req), sweepId, body, actor(req)));
    },
    /** `POST /api/sweeps/:id/fits/preview` → 200 with the fit as it would be saved; stores nothing. */
    async preview(req: Request, res: Response): Promise<void> {
      const sweepId = parseId(req.params);
      const body = parseOrThrow(fitSchema, req.body, 'body') as FitRequest;
      res.json(await previewFit(currentUser(req), sweepId, body));
    },
    /** `GET /api/sweeps/:id/fits`. */
    async list(req: Request, res: Response): Promise<void> {
      res.json(await sweepFits(currentUser(req), parseId(req.params)));
    },
    /** `GET /api/fits/:id`. */
    async get(req: Request, res: Response): Promise<void> {
      res.json(await getFit(currentUser(req), parseId(req.params)));
    },
    /** `DELETE /api/fits/:id` → 204. */
    async remove(req: Request, res: Response): Promise<void> {
      await deleteFit(deps.sequelize, currentUser(req), parseId(req.params), actor(req));
      res.status(204).end();
    },
    /** `GET /api/sweeps/:id/fits.csv`: one row per fitted parameter. */
    async csv(req: Request, res: Response): Promise<void> {
      const sweepId = parseId(req.params);
      const fits = await sweepFits(currentUser(req), sweepId);
      const rows = fits.flatMap((f) =>
        Object.entries(f.parameters).map(([name, value]) => {
          const ci = f.confidenceIntervals[name] ?? null;
          return [
            f.id,
            f.sweepId,
            f.kind,
            f.windowMinK,
            f.windowMaxK,
            name,
            value,
            f.standardErrors[name] ?? null,
            ci ? ci[0] : null,
            ci ? ci[1] : null,
            f.goodness.rSquared,
            f.goodness.count,
            f.goodness.residualRms,
            f.converged,
            f.reason,
            f.reading,
            f.modelVersion,
            f.createdBy.name,
            f.createdAt,
          ];
        }),
      );
      const header = [
        'fit_id',
        'sweep_id',
        'kind',
        'window_min_k',
        'window_max_k',
        'parameter',
        'value',
        'standard_error',
        'ci95_low',
        'ci95_high',
        'r_squared',
        'count',
        'residual_rms',
        'converged',
        'reason',
        'reading',
        'model_version',
        'created_by',
        'created_at',
      ];
      res
        .type('text/csv; charset=utf-8')
        .attachment(`sweep-${sweepId}-fits.csv`)
        .send(toCsv(header, rows));
    },
  };
}
