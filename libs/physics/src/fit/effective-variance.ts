/**
 * A straight line through dwell-step means with effective-variance weights.
 */
import { PHYSICS_DEFAULTS } from '../defaults';
import { invertSpd } from '../numeric/matrix';
import type { DwellStepColumns } from './steps';

/** Result of `effectiveVarianceLine`. */
export interface EffectiveVarianceLine {
  slope: number;
  intercept: number;
  /** Unscaled covariance of [intercept, slope] (multiply by chi² / dof), null if singular. */
  unscaledCovariance: number[][] | null;
  chiSquare: number;
  /** Final weight of each step, 1 / effective variance. */
  weights: Float64Array;
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
  steps: DwellStepColumns,
  x: ArrayLike<number>,
  residualSlopeWithT: (slope: number, temperatureK: number) => number,
  temperatureUncertaintyK: number,
): EffectiveVarianceLine {
  const n = steps.length;
  let xm = 0;
  for (let i = 0; i < n; i++) xm += x[i]!;
  xm /= n;
  const dx = new Float64Array(n);
  for (let i = 0; i < n; i++) dx[i] = x[i]! - xm;
  const y = steps.mean;
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) weights[i] = 1 / steps.varianceOfMean[i]!;
  let fit = weightedLine(dx, y, weights);
  let iterations = 1;
  let converged = true;
  let reason = 'closed-form weighted least squares';
  if (temperatureUncertaintyK > 0) {
    const maxIterations = PHYSICS_DEFAULTS.fitMaxIterations;
    converged = false;
    reason = `effective-variance iteration limit (${maxIterations}) reached`;
    for (; iterations < maxIterations; iterations++) {
      const b = fit.slope;
      for (let i = 0; i < n; i++) {
        const d = residualSlopeWithT(b, steps.temperatureK[i]!) * temperatureUncertaintyK;
        weights[i] = 1 / (steps.varianceOfMean[i]! + d * d);
      }
      fit = weightedLine(dx, y, weights);
      const change = Math.abs(fit.slope - b);
      if (!(change > 1e-12 * Math.max(Math.abs(b), 1e-300))) {
        converged = Number.isFinite(fit.slope);
        reason = converged
          ? 'effective-variance weights settled (slope change below 1e-12, relative)'
          : 'the weighted fit could not be evaluated';
        iterations++;
        break;
      }
    }
  }
  const { intercept: ac, slope: b } = fit;
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

/**
 * Weighted least squares of y = a + b dx through the normal equations (Press et al., Numerical
 * Recipes, 3rd ed., section 15.4), summed in one pass; NaN coefficients when singular.
 */
function weightedLine(
  dx: Float64Array,
  y: ArrayLike<number>,
  w: Float64Array,
): { intercept: number; slope: number; unscaledCovariance: number[][] | null; chiSquare: number } {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let b0 = 0;
  let b1 = 0;
  for (let i = 0; i < dx.length; i++) {
    const wi = w[i]!;
    const d = dx[i]!;
    s0 += wi;
    s1 += wi * d;
    s2 += wi * d * d;
    b0 += wi * y[i]!;
    b1 += wi * d * y[i]!;
  }
  const inv = invertSpd([
    [s0, s1],
    [s1, s2],
  ]);
  const intercept = inv ? inv[0]![0]! * b0 + inv[0]![1]! * b1 : Number.NaN;
  const slope = inv ? inv[1]![0]! * b0 + inv[1]![1]! * b1 : Number.NaN;
  let chiSquare = 0;
  for (let i = 0; i < dx.length; i++) {
    const r = y[i]! - (intercept + slope * dx[i]!);
    chiSquare += w[i]! * r * r;
  }
  return { intercept, slope, unscaledCovariance: inv, chiSquare };
}
