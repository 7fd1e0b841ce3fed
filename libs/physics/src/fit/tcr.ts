/**
 * Linear temperature coefficient of resistance of a metal film, on dwell-step means.
 */
import { PHYSICS_DEFAULTS } from '../defaults';
import { requireObject, requirePositive } from '../validate';
import { effectiveVarianceLine } from './effective-variance';
import type { FitResult } from './fit-result';
import { standardWarnings, uncertaintiesOf, weightedRSquared } from './fit-result';
import { readPoints } from './points';
import type { StepOptions } from './steps';
import { dwellStepColumns, readStepOptions } from './steps';

/** Parameters of `fitLinearTcr`: rho at the reference temperature (ohm cm) and alpha (1/K). */
export type TcrParameter = 'referenceResistivityOhmCm' | 'alphaPerK';

/** Result of `fitLinearTcr`. */
export type LinearTcrFit = FitResult<TcrParameter>;

/**
 * Resistivity at a reference temperature and the linear temperature coefficient.
 *
 * Formula: rho(T) = rho_ref [1 + alpha (T - T_ref)], fitted as the line rho = c0 + c1 (T - T_ref)
 * through the dwell-step means of rho (`dwellSteps`) by weighted least squares (weights 1 /
 * variance of each mean, plus (c1 u_T)^2 with `temperatureUncertaintyK`, Orear 1982), covariance
 * scaled by chi^2 / (steps - 2); rho_ref = c0, alpha = c1 / c0, and by the delta method
 * var(alpha) = [var(c1) - 2 alpha cov(c0, c1) + alpha^2 var(c0)] / c0^2
 * (written without dividing by c1, so alpha = 0 is fine). The correlation matrix is that of
 * (c0, c1). Residuals: ln(rho_measured / rho_fitted(T)) per reading, in input order.
 * Default reference: `PHYSICS_DEFAULTS.tcrReferenceK` = 293.15 K (20 °C), the temperature of
 * handbook alpha values.
 *
 * @param points measured { temperatureK, resistivityOhmCm }, at least 3 steps
 * @param referenceK reference temperature, K
 * @param options step tolerance and temperature uncertainty
 * @example fitLinearTcr([{ temperatureK: 273.15, resistivityOhmCm: 1.5489e-6 }, ...])
 *   // copper: parameters.alphaPerK ≈ 0.0039
 */
export function fitLinearTcr(
  points: Array<{ temperatureK: number; resistivityOhmCm: number }>,
  referenceK: number = PHYSICS_DEFAULTS.tcrReferenceK,
  options: StepOptions = {},
): LinearTcrFit {
  const fn = 'fitLinearTcr';
  const ref = requirePositive(fn, 'referenceK', referenceK);
  const stepOptions = readStepOptions(fn, requireObject(fn, 'options', options ?? {}));
  const [temps, rhos] = readPoints(fn, points, ['temperatureK', 'resistivityOhmCm'], 3) as [
    Float64Array,
    Float64Array,
  ];
  if (temps.every((v) => v === temps[0])) {
    throw new RangeError(
      `\`${fn}\` requires at least two distinct temperatures, got only ${temps[0]} K`,
    );
  }
  const steps = dwellStepColumns(temps, rhos, temps.length, stepOptions.toleranceK);
  if (steps.length < 3) {
    throw new RangeError(
      `\`${fn}\` requires at least 3 temperature steps (readings within ` +
        `options.stepToleranceK = ${stepOptions.toleranceK} K form one step), got ${steps.length}`,
    );
  }
  const line = effectiveVarianceLine(
    steps,
    steps.temperatureK.map((t) => t - ref),
    (c1) => -c1,
    stepOptions.temperatureUncertaintyK,
  );
  const c0 = line.intercept;
  const c1 = line.slope;
  if (!(c0 > 0)) {
    throw new RangeError(
      `\`${fn}\` found a non-positive resistivity at referenceK (${c0}): the reference lies too far outside the data`,
    );
  }
  const residuals = Array.from(temps, (t, i) => Math.log(rhos[i]! / (c0 + c1 * (t - ref))));
  if (!residuals.every(Number.isFinite)) {
    throw new RangeError(`\`${fn}\` found the fitted line at or below 0 inside the data`);
  }
  const dof = steps.length - 2;
  const s2 = line.chiSquare / dof;
  const cov = line.unscaledCovariance?.map((row) => row.map((v) => v * s2)) ?? null;
  const alpha = c1 / c0;
  // Delta method for (c0, alpha): d alpha / d c0 = -alpha / c0, d alpha / d c1 = 1 / c0.
  const covParams = cov
    ? (() => {
        const v00 = cov[0]![0]!;
        const v01 = cov[0]![1]!;
        const v11 = cov[1]![1]!;
        const varAlpha = Math.max(0, (v11 - 2 * alpha * v01 + alpha * alpha * v00) / (c0 * c0));
        const covC0Alpha = (v01 - alpha * v00) / c0;
        return [
          [v00, covC0Alpha],
          [covC0Alpha, varAlpha],
        ];
      })()
    : null;
  const u = uncertaintiesOf<TcrParameter>(
    ['referenceResistivityOhmCm', 'alphaPerK'],
    [c0, alpha],
    ['linear', 'linear'],
    covParams,
    dof,
    line.converged,
  );
  const result: LinearTcrFit = {
    parameters: { referenceResistivityOhmCm: c0, alphaPerK: alpha },
    fitted: ['referenceResistivityOhmCm', 'alphaPerK'],
    ...u,
    residuals,
    count: temps.length,
    stepCount: steps.length,
    degreesOfFreedom: dof,
    rSquared: weightedRSquared(steps.mean, line.weights, line.chiSquare),
    converged: line.converged,
    reason: line.reason,
    iterations: line.iterations,
    warnings: [],
  };
  result.warnings = standardWarnings(result);
  return result;
}
