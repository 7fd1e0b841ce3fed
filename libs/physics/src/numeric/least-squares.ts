/**
 * Ordinary least squares for a straight line, with the parameter covariance.
 */

/** Straight-line fit y = intercept + slope x. */
export interface LineFit {
  slope: number;
  intercept: number;
  slopeStandardError: number;
  interceptStandardError: number;
  /** Covariance of intercept and slope. */
  covariance: number;
  rSquared: number;
  /** Residual variance s^2 = SSR / (n - 2). */
  residualVariance: number;
  residuals: number[];
  count: number;
  meanX: number;
}

/**
 * @internal Fits y = a + b x by least squares, centring x first so the sums do not lose digits.
 * The caller guarantees n >= 3 and a non-zero spread of x.
 */
export function fitLine(x: ArrayLike<number>, y: ArrayLike<number>): LineFit {
  const n = x.length;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sx += x[i]!;
    sy += y[i]!;
  }
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i]! - mx;
    const dy = y[i]! - my;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  const residuals = new Array<number>(n);
  let ssr = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i]! - (intercept + slope * x[i]!);
    residuals[i] = r;
    ssr += r * r;
  }
  const s2 = ssr / (n - 2);
  const varSlope = s2 / sxx;
  const varIntercept = s2 * (1 / n + (mx * mx) / sxx);
  return {
    slope,
    intercept,
    slopeStandardError: Math.sqrt(varSlope),
    interceptStandardError: Math.sqrt(varIntercept),
    covariance: -mx * varSlope,
    rSquared: syy > 0 ? Math.max(0, 1 - ssr / syy) : 1,
    residualVariance: s2,
    residuals,
    count: n,
    meanX: mx,
  };
}
