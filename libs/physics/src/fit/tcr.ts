/**
 * Linear temperature coefficient of resistance of a metal film.
 */
import { PHYSICS_DEFAULTS } from '../defaults';
import { fitLine } from '../numeric/least-squares';
import { studentTCritical } from '../numeric/student-t';
import { requirePositive } from '../validate';
import { readPoints } from './points';

/** Result of `fitLinearTcr`. */
export interface LinearTcrFit {
  /** rho at the reference temperature, ohm cm. */
  referenceResistivityOhmCm: number;
  /** alpha, 1/K. */
  alphaPerK: number;
  standardErrorAlpha: number;
  standardErrorReferenceOhmCm: number;
  /** 95 % interval of alpha, Student's t with n - 2 degrees of freedom. */
  ci95AlphaPerK: [number, number];
  rSquared: number;
  count: number;
  /**
   * Relative residual of each point, in input order: rho_measured / rho_fitted(T) - 1
   * (dimensionless; 0.01 is one per cent above the line).
   */
  relativeResiduals: number[];
}

/**
 * Resistivity at a reference temperature and the linear temperature coefficient.
 *
 * Formula: rho(T) = rho_ref [1 + alpha (T - T_ref)], fitted as the line rho = c0 + c1 (T - T_ref)
 * by least squares; rho_ref = c0, alpha = c1 / c0, and by the delta method
 * var(alpha) = alpha^2 [var(c1)/c1^2 + var(c0)/c0^2 - 2 cov(c0, c1)/(c0 c1)]
 * (written without dividing by c1, so alpha = 0 is fine).
 * Default reference: `PHYSICS_DEFAULTS.tcrReferenceK` = 293.15 K (20 °C), the temperature of
 * handbook alpha values.
 *
 * @param points measured { temperatureK, resistivityOhmCm }, at least 3
 * @param referenceK reference temperature, K
 * @example fitLinearTcr([{ temperatureK: 273.15, resistivityOhmCm: 1.5489e-6 }, ...])
 *   // copper: alphaPerK ≈ 0.0039
 */
export function fitLinearTcr(
  points: Array<{ temperatureK: number; resistivityOhmCm: number }>,
  referenceK: number = PHYSICS_DEFAULTS.tcrReferenceK,
): LinearTcrFit {
  const fn = 'fitLinearTcr';
  const ref = requirePositive(fn, 'referenceK', referenceK);
  const [temps, rhos] = readPoints(fn, points, ['temperatureK', 'resistivityOhmCm'], 3) as [
    Float64Array,
    Float64Array,
  ];
  const x = temps.map((t) => t - ref);
  if (x.every((v) => v === x[0])) {
    throw new RangeError(
      `\`${fn}\` requires at least two distinct temperatures, got only ${temps[0]} K`,
    );
  }
  const line = fitLine(x, rhos);
  const c0 = line.intercept;
  const c1 = line.slope;
  if (!(c0 > 0)) {
    throw new RangeError(
      `\`${fn}\` found a non-positive resistivity at referenceK (${c0}): the reference lies too far outside the data`,
    );
  }
  const alpha = c1 / c0;
  const varC0 = line.interceptStandardError ** 2;
  const varC1 = line.slopeStandardError ** 2;
  const variance = (varC1 - 2 * alpha * line.covariance + alpha * alpha * varC0) / (c0 * c0);
  const se = Math.sqrt(Math.max(0, variance));
  const t = studentTCritical(0.95, line.count - 2);
  const relativeResiduals = Array.from(x, (dx, i) => rhos[i]! / (c0 + c1 * dx) - 1);
  return {
    referenceResistivityOhmCm: c0,
    alphaPerK: alpha,
    standardErrorAlpha: se,
    standardErrorReferenceOhmCm: line.interceptStandardError,
    ci95AlphaPerK: [alpha - t * se, alpha + t * se],
    rSquared: line.rSquared,
    count: line.count,
    relativeResiduals,
  };
}
