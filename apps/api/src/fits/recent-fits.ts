/**
 * `GET /api/fits/recent?limit=&mine=true`: the newest saved fits of sweeps the user may see,
 * labelled with sweep, wafer and lot and carrying the fit's headline parameter, so a bench lists
 * them in one request. `mine=true` keeps only the caller's own fits.
 */
import type { FitKind, RecentFitDto, RecentFitsResponse, SessionUser } from '@rhotrace/api-types';
import { Router, type Request, type Response } from 'express';
import { Op, type WhereOptions } from 'sequelize';
import { z } from 'zod';
import { visibleSweeps } from '../access/visibility.service';
import type { AppDeps } from '../deps';
import { authenticate, currentUser } from '../middleware/authenticate';
import { parseOrThrow } from '../middleware/validate';
import { recentLimitSchema, userNames, waferLabels } from '../sweeps/recent-sweeps';
import { Sweep } from '../sweeps/sweep.model';
import { Fit } from './fit.model';

const querySchema = z
  .object({
    limit: recentLimitSchema,
    mine: z.enum(['true', 'false'], { message: 'must be true or false' }).optional(),
  })
  .strict();

/** The fit's first parameter with its standard error: the value its kind is read by. */
function headlineOf(fit: Fit): RecentFitDto['headline'] {
  const parameters = (fit.parameters ?? {}) as Record<string, number>;
  const errors = (fit.standardErrors ?? {}) as Record<string, number | null>;
  const [parameter, value] = Object.entries(parameters)[0] ?? [];
  if (parameter === undefined || typeof value !== 'number') return null;
  return { parameter, value, standardError: errors[parameter] ?? null };
}

/** The newest `limit` fits on sweeps the user may see (only the user's own when `mine`). */
export async function recentFits(
  user: SessionUser,
  limit: number,
  mine: boolean,
): Promise<RecentFitDto[]> {
  const sweepWhere = visibleSweeps(user);
  const where: WhereOptions<Fit> = mine ? { createdById: user.id } : {};
  // Fits of deleted (or hidden) sweeps are left out: read fits newest first in pages until
  // `limit` visible ones are found.
  const found: Array<{ fit: Fit; sweep: Sweep }> = [];
  const batch = Math.max(limit * 2, 20);
  for (let offset = 0; found.length < limit; offset += batch) {
    const fits = await Fit.findAll({
      where,
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit: batch,
      offset,
    });
    if (fits.length === 0) break;
    const sweeps = await Sweep.findAll({
      where: { [Op.and]: [sweepWhere, { id: [...new Set(fits.map((f) => f.sweepId))] }] },
    });
    const sweepById = new Map(sweeps.map((s) => [s.id, s]));
    for (const fit of fits) {
      const sweep = sweepById.get(fit.sweepId);
      if (sweep && found.length < limit) found.push({ fit, sweep });
    }
    if (fits.length < batch) break;
  }
  const labels = await waferLabels(found.map((f) => f.sweep.waferId));
  const names = await userNames(found.map((f) => f.fit.createdById));
  return found.map(({ fit, sweep }) => {
    const label = labels.get(sweep.waferId);
    return {
      id: fit.id,
      kind: fit.kind as FitKind,
      sweepId: sweep.id,
      sweepName: sweep.originalName,
      waferId: sweep.waferId,
      waferNumber: label?.wafer.number ?? '',
      lotId: label?.wafer.lotId ?? 0,
      lotCode: label?.lot?.code ?? '',
      headline: headlineOf(fit),
      windowMinK: fit.windowMinK,
      windowMaxK: fit.windowMaxK,
      converged: fit.converged,
      reading: fit.reading,
      createdBy: { id: fit.createdById, name: names.get(fit.createdById) ?? null },
      createdAt: fit.createdAt.toISOString(),
    };
  });
}

async function recentFitsHandler(req: Request, res: Response): Promise<void> {
  const { limit, mine } = parseOrThrow(querySchema, req.query, 'query');
  const body: RecentFitsResponse = {
    items: await recentFits(currentUser(req), limit, mine === 'true'),
  };
  res.json(body);
}

/**
 * The recent-fits router. Mount it before the router that owns `/fits/:id`, so `recent` is
 * never read as an id.
 */
export function recentFitsRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/fits/recent', authenticate(deps.config.jwtSecret), recentFitsHandler);
  return router;
}
