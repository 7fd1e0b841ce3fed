import type { FitDto, FitPreviewDto, FitRequest, SessionUser } from '@rhotrace/api-types';
import type { Sequelize } from 'sequelize';
import type { Actor } from '../audit/audit.service';
import { auditChange, recordAudit } from '../audit/audit.service';
import { asNotFound, badRequest, forbidden, notFound } from '../errors';
import { isMetal, isSemiconductor, semiconductorParameterSet } from '../analysis/model.service';
import { withPhysicsOnData } from '../analysis/physics-errors';
import { regimeOfWindow, suggestWindows } from '../analysis/suggested-windows';
import {
  averageSteps,
  pointsInWindow,
  sweepReadings,
  visibleSweep,
  type AnalysisPoint,
} from '../analysis/sweep-data.service';
import { User } from '../users/user.model';
import { type ComputedFit, previewOf, toFitDto } from './fit-dto';
import {
  DEFAULT_TCR_REFERENCE_K,
  arrheniusFit,
  blochGruneisenFit,
  modelFit,
  tcrFit,
  type FitComputation,
} from './fit-kinds';
import { Fit } from './fit.model';

/** Fewest points any fit takes. */
export const MIN_FIT_POINTS = 3;

/** Points of the request's window (the whole sweep when no window is given), at least 3. */
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
  return { points, minK: minK ?? null, maxK: maxK ?? null };
}

/** Runs the requested fit over the sweep the user can see; stores nothing. */
async function computeFit(
  user: SessionUser,
  sweepId: number,
  request: FitRequest,
): Promise<ComputedFit> {
  const v = await visibleSweep(user, sweepId);
  // An Arrhenius fit with its regime given needs only the window's points from the database.
  const windowOnly = request.kind === 'arrhenius' && request.regime !== undefined;
  const { points: all } = await sweepReadings(
    v.sweep,
    windowOnly ? { minK: request.minK, maxK: request.maxK } : undefined,
  );
  const window = windowPoints(all, request.minK, request.maxK);
  let computed: FitComputation;
  let inputs: Record<string, unknown>;
  let parameterSet: string;
  /** Only the bounds the request gave, so stored inputs can be posted again as they are. */
  const bounds = {
    ...(request.minK !== undefined ? { minK: request.minK } : {}),
    ...(request.maxK !== undefined ? { maxK: request.maxK } : {}),
  };
  switch (request.kind) {
    case 'arrhenius': {
      const quantity = request.quantity ?? 'resistivity';
      const prefactorExponent = request.prefactorExponent ?? 0;
      const compensated = request.compensated ?? false;
      const regime =
        request.regime ??
        regimeOfWindow(suggestWindows(averageSteps(all), all), request.minK, request.maxK);
      inputs = {
        kind: 'arrhenius',
        minK: request.minK,
        maxK: request.maxK,
        quantity,
        prefactorExponent,
        ...(regime ? { regime } : {}),
        compensated,
      };
      computed = withPhysicsOnData('Arrhenius fit', () =>
        arrheniusFit(window.points, {
          quantity,
          prefactorExponent,
          material: v.lot.material,
          regime,
          compensated,
        }),
      );
      parameterSet = 'arrhenius';
      break;
    }
    case 'model': {
      const material = request.material ?? v.lot.material;
      if (!isSemiconductor(material)) {
        throw badRequest(`A full-model fit needs a semiconductor; ${material} is not one`, [
          { field: 'body.material', problem: 'must be Si, Ge, GaAs or 4H-SiC' },
        ]);
      }
      inputs = { kind: 'model', material, initial: request.initial, free: request.free, ...bounds };
      computed = withPhysicsOnData('Model fit', () =>
        modelFit(window.points, material, request.initial as never, request.free),
      );
      parameterSet = semiconductorParameterSet(material);
      break;
    }
    case 'tcr': {
      const referenceK = request.referenceK ?? DEFAULT_TCR_REFERENCE_K;
      inputs = { kind: 'tcr', referenceK, ...bounds };
      computed = withPhysicsOnData('TCR fit', () => tcrFit(window.points, referenceK));
      parameterSet = 'linear-tcr';
      break;
    }
    case 'bloch-gruneisen': {
      inputs = { kind: 'bloch-gruneisen', ...bounds };
      computed = withPhysicsOnData('Bloch–Grüneisen fit', () => blochGruneisenFit(window.points));
      parameterSet = 'bloch-gruneisen';
      break;
    }
  }
  if (request.kind === 'arrhenius' && !request.regime && computed.reading) {
    computed.reading += ' (Regime taken from the suggested windows.)';
  }
  if (request.kind === 'bloch-gruneisen' && !isMetal(v.lot.material)) {
    computed.reading = `Bloch–Grüneisen describes metals; this lot is ${v.lot.material}. ${computed.reading ?? ''}`;
  }
  return { inputs, window: { minK: window.minK, maxK: window.maxK }, computed, parameterSet };
}

/** `POST /api/sweeps/:id/fits/preview`: runs the fit and answers it; stores and audits nothing. */
export async function previewFit(
  user: SessionUser,
  sweepId: number,
  request: FitRequest,
): Promise<FitPreviewDto> {
  return previewOf(sweepId, request, await computeFit(user, sweepId, request));
}

/** Runs the requested fit over the sweep and stores it with an audit event. */
export async function createFit(
  sequelize: Sequelize,
  user: SessionUser,
  sweepId: number,
  request: FitRequest,
  actor: Actor,
): Promise<FitDto> {
  const fitted = await computeFit(user, sweepId, request);
  const { inputs, window, computed } = fitted;
  const preview = previewOf(sweepId, request, fitted);
  return sequelize.transaction(async (transaction) => {
    const fit = await Fit.create(
      {
        sweepId,
        kind: request.kind,
        inputs,
        windowMinK: window.minK,
        windowMaxK: window.maxK,
        ...computed,
        modelVersion: preview.modelVersion,
        createdById: user.id,
      },
      { transaction },
    );
    await recordAudit(
      {
        actorId: actor.id,
        action: 'create',
        entity: 'fit',
        entityId: fit.id,
        after: {
          sweepId,
          kind: request.kind,
          inputs,
          parameters: computed.parameters,
          converged: computed.converged,
        },
        requestId: actor.requestId,
      },
      transaction,
    );
    // The answer is made from the values just stored, not read back through the JSON columns
    // (parsing a few thousand residuals again cost more than the fit itself).
    return {
      ...preview,
      id: fit.id,
      createdBy: { id: user.id, name: user.name },
      createdAt: fit.createdAt.toISOString(),
    } satisfies FitDto;
  });
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

/**
 * `DELETE /api/fits/:id`: soft delete with an audit event. Admins and managers may delete any
 * fit, engineers and physicists their own; technicians none.
 */
export async function deleteFit(
  sequelize: Sequelize,
  user: SessionUser,
  fitId: number,
  actor: Actor,
): Promise<void> {
  const fit = await visibleFit(user, fitId);
  const mayDelete =
    user.role === 'admin' ||
    user.role === 'manager' ||
    ((user.role === 'engineer' || user.role === 'physicist') && fit.createdById === user.id);
  if (!mayDelete) {
    throw forbidden(
      user.role === 'technician'
        ? 'Your role may not delete fits'
        : 'You may delete only fits you saved',
    );
  }
  await sequelize.transaction(async (transaction) => {
    const before = await toFitDto(fit);
    await fit.destroy({ transaction });
    await auditChange(transaction, actor, 'delete', 'fit', fit.id, {
      before: { ...before, residuals: undefined },
    });
  });
}
