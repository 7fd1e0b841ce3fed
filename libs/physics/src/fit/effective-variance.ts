/**
 * A straight line through dwell-step means with effective-variance weights.
 */
import { PHYSICS_DEFAULTS } from '../defaults';
import { weightedLeastSquares } from '../numeric/weighted-least-squares';
import type { DwellStep } from './steps';

/** Result of `effectiveVarianceLine`. */
export interface EffectiveVarianceLine {
  slope: number;
  intercept: number;
  /** Unscaled covariance of [intercept, slope] (multiply by chi² / dof), null if singular. */
  unscaledCovariance: number[][] | null;
  chiSquare: number;
  /** Final weight of each step, 1 / effective variance. */
  weights: number[];
  converged: boolean;
  reason: string;
  iterations: number;
}

/**
 * @internal Fits mean = a + b x over the steps with weights 1 / (varianceOfMean + (dr/dT)^2
 * u_T^2), re-evaluating dr/dT at the new slope until the slope settles (J. Orear, Am. J. Phys.
 * 50, 912 (1982)). x is centred for the solve and the result returned in the original basis.
 * With u_T = 0 it is one weighted least-squares solve.
 */
export function effectiveVarianceLine(
  steps: readonly DwellStep[],
  x: readonly number[],
  residualSlopeWithT: (slope: number, temperatureK: number) => number,
  temperatureUncertaintyK: number,
): EffectiveVarianceLine {
  const xm = x.reduce((s, v) => s + v, 0) / x.length;
  const design = x.map((v) => [1, v - xm]);
  const y = steps.map((s) => s.mean);
  let weights = steps.map((s) => 1 / s.varianceOfMean);
  let fit = weightedLeastSquares(design, y, weights);
  let iterations = 1;
  let converged = true;
  let reason = 'closed-form weighted least squares';
  if (temperatureUncertaintyK > 0) {
    const maxIterations = PHYSICS_DEFAULTS.fitMaxIterations;
    converged = false;
    reason = `effective-variance iteration limit (${maxIterations}) reached`;
    for (; iterations < maxIterations; iterations++) {
      const b = fit.coefficients[1]!;
      weights = steps.map((s) => {
        const d = residualSlopeWithT(b, s.temperatureK) * temperatureUncertaintyK;
        return 1 / (s.varianceOfMean + d * d);
      });
      fit = weightedLeastSquares(design, y, weights);
      const change = Math.abs(fit.coefficients[1]! - b);
      if (!(change > 1e-12 * Math.max(Math.abs(b), 1e-300))) {
        converged = Number.isFinite(fit.coefficients[1]!);
        reason = converged
          ? 'effective-variance weights settled (slope change below 1e-12, relative)'
          : 'the weighted fit could not be evaluated';
        iterations++;
        break;
      }
    }
  }
  const [ac, b] = fit.coefficients as [number, number];
  const c = fit.unscaledCovariance;
  // Back from the centred basis: a = ac - b xm.
  const unscaledCovariance = c
    ? [
        [c[0]![0]! - 2 * xm * c[0]![1]! + xm * xm * c[1]![1]!, c[0]![1]! - xm * c[1]![1]!],
        [c[0]![1]! - xm * c[1]![1]!, c[1]![1]!],
      ]
    : null;
  if (!c) {
    converged = false;
    reason = 'the steps do not determine a line (singular normal equations)';
  }
  return {
    slope: b,
    intercept: ac - b * xm,
    unscaledCovariance,
    chiSquare: fit.chiSquare,
    weights,
    converged,
    reason,
    iterations,
  };
}
