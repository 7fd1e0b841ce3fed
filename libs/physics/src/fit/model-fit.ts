/**
 * Full-model fit of a measured rho(T) sweep: dopant densities, levels and a mobility scale.
 */
import { studentTCritical } from '../numeric/student-t';
import { requireArray, requireOneOf } from '../validate';
import type { Doping } from '../semiconductor/dopants';
import {
  checkDoping,
  ionizeDoping,
  MAX_DOPING_CM3,
  resolveIonizationModel,
} from '../semiconductor/dopants';
import type { SemiconductorId } from '../semiconductor/material';
import { requireSemiconductor } from '../semiconductor/material';
import type { ResistivityOptions } from '../semiconductor/resistivity';
import { modelPointUnchecked, resolveModel } from '../semiconductor/resistivity';
import { levenbergMarquardt } from './levenberg-marquardt';
import { readPoints } from './points';

/** Parameters `fitModel` can free. */
export type ModelParameter =
  'donorDensity' | 'acceptorDensity' | 'donorLevel' | 'acceptorLevel' | 'mobilityScale';

const PARAMETERS: readonly ModelParameter[] = [
  'donorDensity',
  'acceptorDensity',
  'donorLevel',
  'acceptorLevel',
  'mobilityScale',
];
/** Fitted on a log scale: positive quantities spanning decades. */
const LOG_SCALE: ReadonlySet<ModelParameter> = new Set([
  'donorDensity',
  'acceptorDensity',
  'mobilityScale',
]);

/** Result of `fitModel`. */
export interface ModelFit {
  /** All parameters, fixed ones included: densities cm^-3, levels eV, mobilityScale. */
  parameters: Record<ModelParameter, number>;
  /** Standard errors of the free parameters in their own units (null: not identifiable). */
  standardErrors: Partial<Record<ModelParameter, number | null>>;
  /** 95 % intervals of the free parameters (asymmetric for the log-scale ones). */
  confidenceIntervals95: Partial<Record<ModelParameter, [number, number] | null>>;
  /** Root mean square of ln(rho_model) - ln(rho_measured). */
  residualRms: number;
  /** ln(rho_model / rho_measured) per point. */
  residuals: number[];
  iterations: number;
  converged: boolean;
  reason: string;
  degreesOfFreedom: number;
}

/**
 * Least-squares fit of the resistivity model (`resistivity`) to a measured sweep.
 *
 * Method: Levenberg–Marquardt (`levenbergMarquardt`) on r_i = ln rho_model(T_i) - ln rho_i, with
 * densities and the mobility scale fitted as logarithms (so they stay positive and steps are
 * relative) and levels in eV. Covariance C = (J^T J)^-1 s^2, s^2 = SSR / (n - k), J the Jacobian
 * at the solution; for log-scale parameters se(P) = P se(ln P) (delta method) and the 95 %
 * interval is exp(ln P ± t se(ln P)), t from Student's t with n - k degrees of freedom.
 * Fixed parameters keep their `initial` values; a free level without an initial value starts at
 * the material's default level; `mobilityScale` starts at 1 unless `options.mobilityScale` says
 * otherwise. `converged` is true only when a convergence test was met (see `reason`).
 * Levels are the isolated (dilute-limit) ionization energies E0; the model lowers them with
 * density exactly as `resistivity` does (`options.ionizationModel`, default per material).
 * Assumptions: equal relative errors on rho; those of `resistivity`.
 *
 * @param points measured { temperatureK, resistivityOhmCm } (more points than free parameters)
 * @param material semiconductor id
 * @param initial starting doping (free densities must be above 0)
 * @param free names of the parameters to fit
 * @param options model options (density-of-states set, mobility model, starting mobility scale)
 */
export function fitModel(
  points: Array<{ temperatureK: number; resistivityOhmCm: number }>,
  material: SemiconductorId,
  initial: Doping,
  free: ModelParameter[],
  options: ResistivityOptions = {},
): ModelFit {
  const fn = 'fitModel';
  const m = requireSemiconductor(fn, material);
  const start = checkDoping(fn, m, initial);
  const ionization = resolveIonizationModel(fn, m, options?.ionizationModel);
  const freeList = requireArray(fn, 'free', free, 1).map((f, i) =>
    requireOneOf(fn, `free[${i}]`, f, PARAMETERS),
  );
  if (new Set(freeList).size !== freeList.length)
    throw new RangeError(`\`${fn}\` requires free to list each parameter once`);
  const model = resolveModel(fn, m, options);
  const [temps, rhos] = readPoints(
    fn,
    points,
    ['temperatureK', 'resistivityOhmCm'],
    freeList.length + 1,
  ) as [Float64Array, Float64Array];
  for (let i = 0; i < temps.length; i++) {
    if (temps[i]! < 1 || temps[i]! > 1500) {
      throw new RangeError(
        `\`${fn}\` requires points[${i}].temperatureK between 1 K and 1500 K, got ${temps[i]}`,
      );
    }
  }
  const values: Record<ModelParameter, number> = {
    donorDensity: start.donorDensity,
    acceptorDensity: start.acceptorDensity,
    donorLevel: start.donorLevel0Ev,
    acceptorLevel: start.acceptorLevel0Ev,
    mobilityScale: model.mobilityScale,
  };
  for (const f of freeList) {
    if (LOG_SCALE.has(f) && !(values[f] > 0)) {
      throw new RangeError(
        `\`${fn}\` requires a starting ${f} above 0 when it is free, got ${values[f]}`,
      );
    }
  }
  const lnRho = Array.from(rhos, Math.log);

  const unpack = (p: readonly number[]): Record<ModelParameter, number> => {
    const v = { ...values };
    freeList.forEach((f, i) => (v[f] = LOG_SCALE.has(f) ? Math.exp(p[i]!) : p[i]!));
    return v;
  };
  const residuals = (p: readonly number[]): Float64Array => {
    const v = unpack(p);
    const out = new Float64Array(temps.length);
    const feasible =
      v.donorDensity <= MAX_DOPING_CM3 &&
      v.acceptorDensity <= MAX_DOPING_CM3 &&
      v.donorLevel > 0 &&
      v.donorLevel <= 1 &&
      v.acceptorLevel > 0 &&
      v.acceptorLevel <= 1 &&
      v.mobilityScale > 1e-6 &&
      v.mobilityScale < 1e6;
    if (!feasible) return out.fill(Number.NaN);
    const d = ionizeDoping(
      m,
      ionization,
      v.donorDensity,
      v.acceptorDensity,
      v.donorLevel,
      v.acceptorLevel,
    );
    const cfg = { ...model, mobilityScale: v.mobilityScale };
    for (let i = 0; i < temps.length; i++)
      out[i] = modelPointUnchecked(cfg, d, temps[i]!).lnResistivity - lnRho[i]!;
    return out;
  };

  const p0 = freeList.map((f) => (LOG_SCALE.has(f) ? Math.log(values[f]) : values[f]));
  const lm = levenbergMarquardt({ residuals, initial: p0 });
  const n = temps.length;
  const k = freeList.length;
  const dof = n - k;
  const s2 = lm.cost / dof;
  const t = studentTCritical(0.95, dof);
  const fitted = unpack(lm.parameters);
  const standardErrors: ModelFit['standardErrors'] = {};
  const confidenceIntervals95: ModelFit['confidenceIntervals95'] = {};
  freeList.forEach((f, i) => {
    const variance = lm.unscaledCovariance ? lm.unscaledCovariance[i]![i]! * s2 : Number.NaN;
    if (!(variance >= 0) || !Number.isFinite(variance)) {
      standardErrors[f] = null;
      confidenceIntervals95[f] = null;
      return;
    }
    const se = Math.sqrt(variance);
    const p = lm.parameters[i]!;
    if (LOG_SCALE.has(f)) {
      standardErrors[f] = fitted[f] * se;
      confidenceIntervals95[f] = [Math.exp(p - t * se), Math.exp(p + t * se)];
    } else {
      standardErrors[f] = se;
      confidenceIntervals95[f] = [p - t * se, p + t * se];
    }
  });
  const residualRms = Number.isFinite(lm.cost) ? Math.sqrt(lm.cost / n) : Number.MAX_VALUE;
  return {
    parameters: fitted,
    standardErrors,
    confidenceIntervals95,
    residualRms,
    residuals: lm.residuals.map((r) => (Number.isFinite(r) ? r : 0)),
    iterations: lm.iterations,
    converged: lm.converged,
    reason: lm.reason,
    degreesOfFreedom: dof,
  };
}
