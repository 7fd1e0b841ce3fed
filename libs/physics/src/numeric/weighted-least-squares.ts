/**
 * Weighted linear least squares for a few coefficients, with the unscaled covariance.
 */
import { invertSpd } from './matrix';

/** Result of `weightedLeastSquares`. */
export interface WeightedLeastSquares {
  coefficients: number[];
  /** (X^T W X)^-1, or null when the design is singular. */
  unscaledCovariance: number[][] | null;
  /** Weighted sum of squared residuals, sum w_i (y_i - X_i c)^2. */
  chiSquare: number;
  /** y_i - X_i c for each row. */
  residuals: number[];
}

/**
 * @internal Minimizes sum w_i (y_i - sum_j X_ij c_j)^2 through the normal equations
 * (X^T W X) c = X^T W y, solved by the inverse (Press et al., Numerical Recipes, 3rd ed.,
 * section 15.4). The caller centres its regressors so the equations keep their digits and
 * passes positive finite weights.
 */
export function weightedLeastSquares(
  design: ReadonlyArray<readonly number[]>,
  y: ArrayLike<number>,
  weights: ArrayLike<number>,
): WeightedLeastSquares {
  const k = design[0]?.length ?? 0;
  const a = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  const b = new Array<number>(k).fill(0);
  design.forEach((row, i) => {
    const w = weights[i]!;
    for (let p = 0; p < k; p++) {
      b[p] = b[p]! + w * row[p]! * y[i]!;
      for (let q = 0; q <= p; q++) a[p]![q] = a[p]![q]! + w * row[p]! * row[q]!;
    }
  });
  for (let p = 0; p < k; p++) for (let q = p + 1; q < k; q++) a[p]![q] = a[q]![p]!;
  const inv = invertSpd(a);
  const coefficients = inv
    ? inv.map((row) => row.reduce((s, v, j) => s + v * b[j]!, 0))
    : new Array<number>(k).fill(Number.NaN);
  let chiSquare = 0;
  const residuals = design.map((row, i) => {
    const r = y[i]! - row.reduce((s, v, j) => s + v * coefficients[j]!, 0);
    chiSquare += weights[i]! * r * r;
    return r;
  });
  return { coefficients, unscaledCovariance: inv, chiSquare, residuals };
}
