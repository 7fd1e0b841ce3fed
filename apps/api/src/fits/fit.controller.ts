import type { Request, Response } from 'express';
import { alsoShownIn, type FitRequest } from '@rhotrace/api-types';
import type { AppDeps } from '../deps';
import { toCsv } from '../analysis/csv';
import { actorOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import { parseId, parseOrThrow } from '../middleware/validate';
import { FIT_KIND_TABLE } from './fit-kinds';
import { fitKindSchema } from './fit-schemas';
import { createFit, deleteFit, getFit, previewFit, sweepFits } from './fit.service';

/** A parameter's value in ppm/K when that is its second unit (a TCR), else an empty cell. */
function ppm(name: string, value: number): number | null {
  const also = alsoShownIn(name, value);
  return also?.unit === 'ppm/K' ? also.value : null;
}

/** The body checked first for its kind, then by that kind's schema in `FIT_KIND_TABLE`. */
function parseFitRequest(body: unknown): FitRequest {
  const { kind } = parseOrThrow(fitKindSchema, body, 'body');
  return parseOrThrow(FIT_KIND_TABLE[kind].schema, body, 'body');
}

/** Handlers of fits. */
export function fitsController(deps: AppDeps) {
  return {
    /** `POST /api/sweeps/:id/fits` → 201 with the stored fit. */
    async create(req: Request, res: Response): Promise<void> {
      const sweepId = parseId(req.params);
      const body = parseFitRequest(req.body);
      // A connection closed before the answer is written is a cancelled request: store nothing.
      const cancel = new AbortController();
      res.on('close', () => {
        if (!res.writableFinished) cancel.abort();
      });
      const fit = await createFit(
        deps.sequelize,
        currentUser(req),
        sweepId,
        body,
        actorOf(req),
        cancel.signal,
      );
      res.status(201).json(fit);
    },
    /** `POST /api/sweeps/:id/fits/preview` → 200 with the fit as it would be saved (not stored). */
    async preview(req: Request, res: Response): Promise<void> {
      const sweepId = parseId(req.params);
      res.json(await previewFit(currentUser(req), sweepId, parseFitRequest(req.body)));
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
      await deleteFit(deps.sequelize, currentUser(req), parseId(req.params), actorOf(req));
      res.status(204).end();
    },
    /** `GET /api/sweeps/:id/fits.csv`: one row per fitted parameter. */
    async csv(req: Request, res: Response): Promise<void> {
      const sweepId = parseId(req.params);
      const fits = await sweepFits(currentUser(req), sweepId);
      const rows = fits.flatMap((f) =>
        Object.entries(f.parameters).map(([name, value]) => {
          const ci = f.confidenceIntervals[name] ?? null;
          const se = f.standardErrors[name];
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
            // A TCR is also given in ppm/K (added columns; the 1/K value above stays as it was).
            ppm(name, value),
            se === null || se === undefined ? null : ppm(name, se),
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
        'value_ppm_per_k',
        'standard_error_ppm_per_k',
      ];
      res
        .type('text/csv; charset=utf-8')
        .attachment(`sweep-${sweepId}-fits.csv`)
        .send(toCsv(header, rows));
    },
  };
}
