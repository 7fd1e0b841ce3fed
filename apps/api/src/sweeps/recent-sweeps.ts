/**
 * `GET /api/sweeps/recent?limit=`: the newest sweeps the user may see, labelled with wafer
 * number, lot code and uploader, so a bench lists them in one request. Technicians see only
 * sweeps of wafers assigned to them.
 */
import {
  DEFAULT_RECENT_LIMIT,
  MAX_RECENT_LIMIT,
  type RecentSweepDto,
  type RecentSweepsResponse,
  type SessionUser,
  type SweepMethod,
} from '@rhotrace/api-types';
import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { visibleSweeps } from '../access/visibility.service';
import type { AppDeps } from '../deps';
import { Lot } from '../lots/lot.model';
import { authenticate, currentUser } from '../middleware/authenticate';
import { parseOrThrow } from '../middleware/validate';
import { User } from '../users/user.model';
import { Wafer } from '../wafers/wafer.model';
import { Sweep } from './sweep.model';

/** `limit` of the recent-activity lists: 1 to MAX_RECENT_LIMIT, default DEFAULT_RECENT_LIMIT. */
export const recentLimitSchema = z.coerce
  .number({ invalid_type_error: 'must be a whole number' })
  .int('must be a whole number')
  .min(1, 'must be at least 1')
  .max(MAX_RECENT_LIMIT, `must be at most ${MAX_RECENT_LIMIT}`)
  .default(DEFAULT_RECENT_LIMIT);

const querySchema = z.object({ limit: recentLimitSchema }).strict();

/** Names of the given users by id. */
export async function userNames(ids: number[]): Promise<Map<number, string>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const users = await User.findAll({ attributes: ['id', 'name'], where: { id: unique } });
  return new Map(users.map((u) => [u.id, u.name]));
}

/** Wafers and their lots by wafer id, for labelling. */
export async function waferLabels(
  waferIds: number[],
): Promise<Map<number, { wafer: Wafer; lot: Lot | undefined }>> {
  const unique = [...new Set(waferIds)];
  if (unique.length === 0) return new Map();
  const wafers = await Wafer.findAll({ where: { id: unique }, paranoid: false });
  const lots = await Lot.findAll({
    where: { id: [...new Set(wafers.map((w) => w.lotId))] },
    paranoid: false,
  });
  const lotById = new Map(lots.map((l) => [l.id, l]));
  return new Map(wafers.map((w) => [w.id, { wafer: w, lot: lotById.get(w.lotId) }]));
}

/** The newest `limit` sweeps the user may see, newest first. */
export async function recentSweeps(user: SessionUser, limit: number): Promise<RecentSweepDto[]> {
  const sweeps = await Sweep.findAll({
    where: visibleSweeps(user),
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit,
  });
  const labels = await waferLabels(sweeps.map((s) => s.waferId));
  const names = await userNames(sweeps.map((s) => s.uploadedById));
  return sweeps.map((s) => {
    const label = labels.get(s.waferId);
    return {
      id: s.id,
      waferId: s.waferId,
      waferNumber: label?.wafer.number ?? '',
      lotId: label?.wafer.lotId ?? 0,
      lotCode: label?.lot?.code ?? '',
      material: label?.lot?.material ?? '',
      method: s.method as SweepMethod,
      originalName: s.originalName,
      pointCount: s.pointCount,
      minTemperatureK: s.minTemperatureK,
      maxTemperatureK: s.maxTemperatureK,
      uploadedBy: { id: s.uploadedById, name: names.get(s.uploadedById) ?? null },
      createdAt: s.createdAt.toISOString(),
    };
  });
}

async function recentSweepsHandler(req: Request, res: Response): Promise<void> {
  const { limit } = parseOrThrow(querySchema, req.query, 'query');
  const body: RecentSweepsResponse = { items: await recentSweeps(currentUser(req), limit) };
  res.json(body);
}

/**
 * The recent-sweeps router. Mount it before the router that owns `/sweeps/:id`, so `recent`
 * is never read as an id.
 */
export function recentSweepsRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/sweeps/recent', authenticate(deps.config.jwtSecret), recentSweepsHandler);
  return router;
}
