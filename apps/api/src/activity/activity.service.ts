/**
 * Recent activity for a bench, each list in one request: the newest sweeps and saved fits the
 * user may see, labelled with wafer number, lot code and who made them.
 */
import type {
  FitKind,
  RecentFitDto,
  RecentSweepDto,
  SessionUser,
  SweepMethod,
} from '@rhotrace/api-types';
import { Op } from 'sequelize';
import { visibleFits, visibleSweeps } from '../access/visibility.service';
import { Fit } from '../fits/fit.model';
import { Lot } from '../lots/lot.model';
import { Sweep } from '../sweeps/sweep.model';
import { User } from '../users/user.model';
import { Wafer } from '../wafers/wafer.model';

const NEWEST_FIRST: Array<[string, 'DESC']> = [
  ['createdAt', 'DESC'],
  ['id', 'DESC'],
];

/** Names of the given users by id. */
async function userNames(ids: number[]): Promise<Map<number, string>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const users = await User.findAll({ attributes: ['id', 'name'], where: { id: unique } });
  return new Map(users.map((u) => [u.id, u.name]));
}

/** Wafers and their lots by wafer id (deleted ones too), for labelling. */
async function waferLabels(
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
  const sweeps = await Sweep.findAll({ where: visibleSweeps(user), order: NEWEST_FIRST, limit });
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

/** The fit's first parameter with its standard error: the value its kind is read by. */
function headlineOf(fit: Fit): RecentFitDto['headline'] {
  const parameters = (fit.parameters ?? {}) as Record<string, number>;
  const errors = (fit.standardErrors ?? {}) as Record<string, number | null>;
  const [parameter, value] = Object.entries(parameters)[0] ?? [];
  if (parameter === undefined || typeof value !== 'number') return null;
  return { parameter, value, standardError: errors[parameter] ?? null };
}

/**
 * The newest `limit` fits on sweeps the user may see (fits of deleted or hidden sweeps left
 * out), only the user's own when `mine`.
 */
export async function recentFits(
  user: SessionUser,
  limit: number,
  mine: boolean,
): Promise<RecentFitDto[]> {
  const fits = await Fit.findAll({
    where: { [Op.and]: [visibleFits(user), mine ? { createdById: user.id } : {}] },
    order: NEWEST_FIRST,
    limit,
  });
  const sweeps = await Sweep.findAll({ where: { id: [...new Set(fits.map((f) => f.sweepId))] } });
  const sweepById = new Map(sweeps.map((s) => [s.id, s]));
  const found = fits.flatMap((fit) => {
    const sweep = sweepById.get(fit.sweepId);
    return sweep ? [{ fit, sweep }] : [];
  });
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
