import type { FitDto, FitPreviewDto, FitRequest, SessionUser } from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';
import type { Sequelize } from 'sequelize';
import { assertMayDeleteFit } from '../access/policy';
import { visibleSweep } from '../access/visibility.service';
import type { Actor } from '../audit/audit.service';
import { auditChange, recordAudit } from '../audit/audit.service';
import { asNotFound, badRequest, conflict, notFound } from '../errors';
import { modelVersion } from '../analysis/model-version';
import { chooseLeg, describeLegs } from '../analysis/legs';
import {
  pointsInWindow,
  legReadings,
  sweepFitReadings,
  type AnalysisPoint,
} from '../analysis/sweep-data.service';
import { User } from '../users/user.model';
import { runFitKind } from './fit-kinds';
import { Fit } from './fit.model';

/** Fewest points any fit takes. */
export const MIN_FIT_POINTS = 3;

/**
 * The one place a stored fit becomes its API shape, for the answer to a POST (from the values
 * just stored) and for every read alike. Fits stored before dwell steps read with
 * `stepCount` null and empty lists.
 */
export function fitDtoOf(fit: Fit, createdBy: FitDto['createdBy']): FitDto {
  return {
    id: fit.id,
    sweepId: fit.sweepId,
    kind: fit.kind,
    inputs: fit.inputs,
    windowMinK: fit.windowMinK,
    windowMaxK: fit.windowMaxK,
    parameters: fit.parameters,
    standardErrors: fit.standardErrors,
    confidenceIntervals: fit.confidenceIntervals,
    goodness: fit.goodness,
    residuals: fit.residuals,
    converged: fit.converged,
    reason: fit.reason,
    reading: fit.reading,
    stepCount: fit.stepCount,
    excludedSequences: fit.excludedSequences ?? [],
    interpretation: fit.interpretation ?? null,
    curvature: fit.curvature ?? null,
    warnings: fit.warnings ?? [],
    modelVersion: fit.modelVersion,
    createdBy,
    createdAt: fit.createdAt.toISOString(),
  };
}

/** Shapes a stored fit for the API, naming who saved it. */
export async function toFitDto(fit: Fit, names?: Map<number, string>): Promise<FitDto> {
  const name = names?.get(fit.createdById) ?? (await User.findByPk(fit.createdById))?.name ?? null;
  return fitDtoOf(fit, { id: fit.createdById, name });
}

/**
 * Points of the request's window (the whole sweep when no window is given), at least 3; the
 * bounds given are clipped to the readings inside them.
 */
function windowPoints(
  all: readonly AnalysisPoint[],
  minK: number | undefined,
  maxK: number | undefined,
): { points: AnalysisPoint[]; minK: number | null; maxK: number | null } {
  if (minK === undefined && maxK === undefined) {
    if (all.length < MIN_FIT_POINTS) {
      throw badRequest(
        `The sweep has ${all.length} usable points; a fit needs at least ${MIN_FIT_POINTS}`,
      );
    }
    return {
      points: [...all],
      minK: all[0]!.temperatureK,
      maxK: all[all.length - 1]!.temperatureK,
    };
  }
  const lo = minK ?? 0;
  const hi = maxK ?? Number.POSITIVE_INFINITY;
  const points = pointsInWindow(all, lo, hi);
  if (points.length < MIN_FIT_POINTS) {
    throw badRequest(
      `The window ${minK ?? 'start'}–${maxK ?? 'end'} K holds ${points.length} point` +
        `${points.length === 1 ? '' : 's'}; a fit needs at least ${MIN_FIT_POINTS}`,
      [
        {
          field: 'body.minK',
          problem: `the window holds ${points.length} points; at least ${MIN_FIT_POINTS} needed`,
        },
      ],
    );
  }
  // A window reaching past the data is stored as far as the data go.
  return {
    points,
    minK: minK === undefined ? null : Math.max(minK, points[0]!.temperatureK),
    maxK: maxK === undefined ? null : Math.min(maxK, points[points.length - 1]!.temperatureK),
  };
}

/**
 * Runs the requested fit over the sweep the user can see (its kind's entry in `FIT_KIND_TABLE`)
 * and shapes it as it would be saved; stores nothing. Flagged readings are left out unless
 * `includeFlagged`; their sequence numbers inside the window go with the fit.
 */
export async function previewFit(
  user: SessionUser,
  sweepId: number,
  request: FitRequest,
): Promise<FitPreviewDto> {
  const v = await visibleSweep(user, sweepId);
  const includeFlagged = request.includeFlagged ?? false;
  const stepToleranceK = request.stepToleranceK ?? PHYSICS_DEFAULTS.fitStepToleranceK;
  const temperatureUncertaintyK =
    request.temperatureUncertaintyK ?? PHYSICS_DEFAULTS.fitTemperatureUncertaintyK;
  const leg = chooseLeg(describeLegs(await legReadings(v.sweep)), request.leg);
  const readings = await sweepFitReadings(v.sweep, includeFlagged, leg, request.site ?? null);
  const window = windowPoints(readings.points, request.minK, request.maxK);
  const run = runFitKind(request.kind, request, {
    points: window.points,
    all: readings.points,
    material: v.lot.material,
    dopant: v.lot.dopant,
    stepToleranceK,
    temperatureUncertaintyK,
  });
  const lo = request.minK ?? Number.NEGATIVE_INFINITY;
  const hi = request.maxK ?? Number.POSITIVE_INFINITY;
  const excludedSequences = readings.excluded
    .filter((e) => e.temperatureK >= lo && e.temperatureK <= hi)
    .map((e) => e.sequence)
    .sort((a, b) => a - b);
  const computed = run.computation;
  if (excludedSequences.length) {
    computed.warnings.push(
      `${excludedSequences.length} flagged reading(s) in the window were left out ` +
        '(ask for flagged readings to be fitted too to keep them).',
    );
  }
  const clipped = clippedWarning(request, window);
  if (clipped) computed.warnings.push(clipped);
  return {
    sweepId,
    kind: request.kind,
    // the request's own bounds and the step options, so stored inputs can be posted again
    inputs: {
      ...run.inputs,
      ...(request.minK !== undefined ? { minK: request.minK } : {}),
      ...(request.maxK !== undefined ? { maxK: request.maxK } : {}),
      includeFlagged,
      stepToleranceK,
      temperatureUncertaintyK,
      leg: leg ?? 'all',
      ...(request.site !== undefined ? { site: request.site } : {}),
    },
    windowMinK: window.minK,
    windowMaxK: window.maxK,
    ...computed,
    excludedSequences,
    modelVersion: modelVersion(run.parameterSet),
  };
}

/**
 * Runs the requested fit as `previewFit` does and stores it with an audit event, unless
 * `cancelled` fires first: a person who cancelled a long fit must not find it saved. The fit
 * itself runs without yielding, so the check comes after it, once pending events (the client's
 * closed connection among them) have been seen, and again before the transaction commits.
 */
export async function createFit(
  sequelize: Sequelize,
  user: SessionUser,
  sweepId: number,
  request: FitRequest,
  actor: Actor,
  cancelled?: AbortSignal,
): Promise<FitDto> {
  const preview = await previewFit(user, sweepId, request);
  await new Promise((resolve) => setImmediate(resolve));
  refuseIfCancelled(cancelled);
  return sequelize.transaction(async (transaction) => {
    const fit = await Fit.create({ ...preview, createdById: user.id }, { transaction });
    await recordAudit(
      {
        actorId: actor.id,
        action: 'create',
        entity: 'fit',
        entityId: fit.id,
        after: {
          sweepId,
          kind: request.kind,
          inputs: preview.inputs,
          parameters: preview.parameters,
          converged: preview.converged,
        },
        requestId: actor.requestId,
      },
      transaction,
    );
    // Thrown inside the transaction, so it rolls the fit and its audit event back.
    refuseIfCancelled(cancelled);
    // Made from the values just stored, not read back through the JSON columns (parsing a few
    // thousand residuals again cost more than the fit itself).
    return fitDtoOf(fit, { id: user.id, name: user.name });
  });
}

function refuseIfCancelled(cancelled: AbortSignal | undefined): void {
  if (cancelled?.aborted)
    throw conflict('The fit was cancelled before it was stored; nothing was saved.');
}

/** The caution for a window reaching past the readings, which is fitted as far as they go. */
function clippedWarning(
  request: FitRequest,
  window: { minK: number | null; maxK: number | null },
): string | null {
  const low = request.minK !== undefined && window.minK !== null && window.minK > request.minK;
  const high = request.maxK !== undefined && window.maxK !== null && window.maxK < request.maxK;
  if (!low && !high) return null;
  const asked = `${request.minK ?? 'start'}–${request.maxK ?? 'end'} K`;
  return (
    `The window asked for (${asked}) reaches past the readings; it was fitted and is stored ` +
    `as ${window.minK?.toFixed(2)}–${window.maxK?.toFixed(2)} K, the readings inside it.`
  );
}

/** Saved fits of a sweep, oldest first (no visibility check: callers check the sweep). */
export async function listFitsOfSweep(sweepId: number): Promise<FitDto[]> {
  const fits = await Fit.findAll({ where: { sweepId }, order: [['id', 'ASC']] });
  const users = await User.findAll({ where: { id: [...new Set(fits.map((f) => f.createdById))] } });
  const names = new Map(users.map((u) => [u.id, u.name]));
  return Promise.all(fits.map((f) => toFitDto(f, names)));
}

/** `GET /api/sweeps/:id/fits`. */
export async function sweepFits(user: SessionUser, sweepId: number): Promise<FitDto[]> {
  await visibleSweep(user, sweepId);
  return listFitsOfSweep(sweepId);
}

async function visibleFit(user: SessionUser, fitId: number): Promise<Fit> {
  const fit = await Fit.findByPk(fitId);
  if (!fit) throw notFound(`Fit ${fitId}`);
  try {
    await visibleSweep(user, fit.sweepId);
  } catch (error) {
    throw asNotFound(error, `Fit ${fitId}`);
  }
  return fit;
}

/** `GET /api/fits/:id`. */
export async function getFit(user: SessionUser, fitId: number): Promise<FitDto> {
  return toFitDto(await visibleFit(user, fitId));
}

/** `DELETE /api/fits/:id`: soft delete with an audit event, when `mayDeleteFit` allows it. */
export async function deleteFit(
  sequelize: Sequelize,
  user: SessionUser,
  fitId: number,
  actor: Actor,
): Promise<void> {
  const fit = await visibleFit(user, fitId);
  assertMayDeleteFit(user, fit);
  await sequelize.transaction(async (transaction) => {
    const before = await toFitDto(fit);
    await fit.destroy({ transaction });
    await auditChange(transaction, actor, 'delete', 'fit', fit.id, {
      before: { ...before, residuals: undefined },
    });
  });
}
