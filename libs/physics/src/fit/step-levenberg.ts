/**
 * Nonlinear fits of ln rho through dwell-step means: the shared core of `fitModel` and
 * `fitBlochGruneisen`.
 */
import { levenbergMarquardt } from './levenberg-marquardt';
import type { FitResult, ParameterScale } from './fit-result';
import { standardWarnings, uncertaintiesOf, weightedRSquared } from './fit-result';
import { dwellSteps } from './steps';

/** @internal Problem of `fitLnRhoSteps`. */
export interface LnRhoStepProblem<P extends string> {
  fn: string;
  temperaturesK: ArrayLike<number>;
  resistivitiesOhmCm: ArrayLike<number>;
  toleranceK: number;
  temperatureUncertaintyK: number;
  /** Fitted parameters, their coordinate scales and starting coordinates. */
  names: readonly P[];
  scales: readonly ParameterScale[];
  initial: readonly number[];
  /** Parameter = factor x coordinate for linear-scale ones (default 1). */
  factors?: readonly number[];
  /**
   * The model's ln rho(T) for coordinates q (prepared once per q), or null where q is
   * infeasible.
   */
  lnModel: (q: readonly number[]) => ((temperatureK: number) => number) | null;
  /**
   * The model's ln rho(T) that also writes d ln rho / dq into `gradient`, or null where q is
   * infeasible; without it the solver takes forward differences of `lnModel`.
   */
  lnModelGradient?: (
    q: readonly number[],
  ) => ((temperatureK: number, gradient: Float64Array) => number) | null;
  /**
   * Maps the solver's coordinates and their covariance to the reported ones (`names`, `scales`);
   * default: the same.
   */
  reported?: (
    q: readonly number[],
    covariance: number[][] | null,
  ) => { coordinates: number[]; covariance: number[][] | null };
  /** Every parameter (fixed ones too) for coordinates q. */
  parametersOf: (q: readonly number[]) => Record<P, number>;
}

/** Rounds of effective-variance reweighting after the first solve. */
const EFFECTIVE_VARIANCE_ROUNDS = 3;

/**
 * @internal Levenberg–Marquardt on whitened step residuals (ln rho_model(T_s) - mean_s) / sigma_s,
 * sigma_s^2 the variance of the step mean (`dwellSteps`) plus (d ln rho_model / dT)^2 u_T^2
 * (central difference; Orear 1982), reweighted and refitted `EFFECTIVE_VARIANCE_ROUNDS` times
 * when u_T > 0. Covariance (J^T J)^-1 chi^2 / (steps - k); no intervals unless converged.
 */
export function fitLnRhoSteps<P extends string>(problem: LnRhoStepProblem<P>): FitResult<P> {
  const { fn, temperaturesK: temps, names } = problem;
  const lnRho = Array.from(problem.resistivitiesOhmCm, Math.log);
  const steps = dwellSteps(temps, lnRho, problem.toleranceK);
  const k = names.length;
  if (steps.length <= k) {
    throw new RangeError(
      `\`${fn}\` requires more temperature steps than fitted parameters (${k}); got ` +
        `${steps.length} (readings within options.stepToleranceK = ${problem.toleranceK} K form one step)`,
    );
  }
  let variances = steps.map((s) => s.varianceOfMean);
  const solve = (start: readonly number[]) => {
    const sigma = variances.map(Math.sqrt);
    return levenbergMarquardt({
      residuals: (q) => {
        const out = new Float64Array(steps.length);
        const model = problem.lnModel(q);
        if (!model) return out.fill(Number.NaN);
        for (let i = 0; i < steps.length; i++) {
          out[i] = (model(steps[i]!.temperatureK) - steps[i]!.mean) / sigma[i]!;
        }
        return out;
      },
      jacobian: problem.lnModelGradient && ((q) => whitenedJacobian(q, sigma)),
      initial: start,
    });
  };
  const whitenedJacobian = (q: readonly number[], sigma: number[]): Float64Array[] | null => {
    const model = problem.lnModelGradient!(q);
    if (!model) return null;
    const cols = names.map(() => new Float64Array(steps.length));
    const gradient = new Float64Array(k);
    for (let i = 0; i < steps.length; i++) {
      model(steps[i]!.temperatureK, gradient);
      for (let j = 0; j < k; j++) cols[j]![i] = gradient[j]! / sigma[i]!;
    }
    return cols;
  };
  let lm = solve(problem.initial);
  let iterations = lm.iterations;
  const uT = problem.temperatureUncertaintyK;
  for (let round = 0; uT > 0 && lm.converged && round < EFFECTIVE_VARIANCE_ROUNDS; round++) {
    const model = problem.lnModel(lm.parameters);
    if (!model) break;
    variances = steps.map((s) => {
      const h = 1e-3 * s.temperatureK;
      const slope = (model(s.temperatureK + h) - model(s.temperatureK - h)) / (2 * h);
      return s.varianceOfMean + (Number.isFinite(slope) ? slope * uT : 0) ** 2;
    });
    lm = solve(lm.parameters);
    iterations += lm.iterations;
  }
  const dof = steps.length - k;
  const s2 = lm.cost / dof;
  const solved = lm.unscaledCovariance?.map((row) => row.map((v) => v * s2)) ?? null;
  const { coordinates, covariance } = problem.reported
    ? problem.reported(lm.parameters, solved)
    : { coordinates: lm.parameters, covariance: solved };
  const u = uncertaintiesOf(
    names,
    coordinates,
    problem.scales,
    covariance,
    dof,
    lm.converged,
    problem.factors,
  );
  const finalModel = problem.lnModel(lm.parameters);
  const residuals = Array.from(temps, (t, i) =>
    finalModel ? lnRho[i]! - finalModel(t) : Number.NaN,
  );
  const result: FitResult<P> = {
    parameters: problem.parametersOf(lm.parameters),
    fitted: [...names],
    ...u,
    // A model that cannot be evaluated at the final point leaves no residual to report.
    residuals: residuals.map((r) => (Number.isFinite(r) ? r : 0)),
    count: temps.length,
    stepCount: steps.length,
    degreesOfFreedom: dof,
    rSquared: weightedRSquared(
      steps.map((s) => s.mean),
      variances.map((v) => 1 / v),
      lm.cost,
    ),
    converged: lm.converged,
    reason: lm.reason,
    iterations,
    warnings: [],
  };
  result.warnings = standardWarnings(result);
  return result;
}
