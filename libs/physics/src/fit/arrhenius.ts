/**
 * Arrhenius fit of a thermally activated resistivity or conductivity.
 */
import { BOLTZMANN_EV_PER_K } from '../constants';
import { PHYSICS_DEFAULTS } from '../defaults';
import { fitLine } from '../numeric/least-squares';
import { studentTCritical } from '../numeric/student-t';
import { requireFiniteNumber, requireObject, requireOneOf } from '../validate';
import { readPoints } from './points';

/** Options of `fitArrhenius`. */
export interface ArrheniusOptions {
  /** Fitted quantity; default `PHYSICS_DEFAULTS.arrheniusQuantity` ('resistivity'). */
  quantity?: 'resistivity' | 'conductivity';
  /** Exponent m of the T^m prefactor; default `PHYSICS_DEFAULTS.arrheniusPrefactorExponent` (0). */
  prefactorExponent?: number;
  /** Lowest temperature used, K (inclusive). */
  minK?: number;
  /** Highest temperature used, K (inclusive). */
  maxK?: number;
}

/** Result of `fitArrhenius`. */
export interface ArrheniusFit {
  /** Activation energy Ea, eV (positive for a thermally activated process). */
  activationEnergyEv: number;
  standardErrorEv: number;
  /** 95 % interval, Student's t with n - 2 degrees of freedom. */
  ci95Ev: [number, number];
  rSquared: number;
  /** Points inside the window. */
  count: number;
  /** a in the fitted line (see `fitArrhenius`). */
  intercept: number;
  interceptStandardError: number;
  /** Residuals of the fitted logarithm, in window order. */
  residuals: number[];
  /** Critical t value used for the interval. */
  tCritical: number;
}

/**
 * Activation energy from an Arrhenius plot over a temperature window.
 *
 * Formula (x = 1 / (k T), k in eV/K, m = prefactorExponent):
 *   resistivity:  ln(value * T^m)  = a + Ea x
 *   conductivity: ln(value * T^-m) = a - Ea x
 * fitted by ordinary least squares, so Ea > 0 for a thermally activated process either way.
 * Standard error from the residual variance s^2 = SSR / (n - 2); the 95 % interval is
 * Ea ± t(0.975, n - 2) * se. `minK` and `maxK` are inclusive; fewer than 3 points in the window,
 * or a single temperature, is an error.
 * Assumptions: independent errors of equal variance in ln(value) (a constant relative error).
 * Source: least squares as in Press et al., Numerical Recipes, 3rd ed. (2007), section 15.2.
 *
 * @param points measured { temperatureK, value } pairs (value in ohm cm or S/cm, > 0)
 * @param options quantity, prefactor exponent, window
 * @example fitArrhenius([{ temperatureK: 500, value: Math.exp(0.6 / (k * 500)) }, ...])
 *   // activationEnergyEv ≈ 0.6
 */
export function fitArrhenius(
  points: Array<{ temperatureK: number; value: number }>,
  options: ArrheniusOptions = {},
): ArrheniusFit {
  const fn = 'fitArrhenius';
  const o = requireObject(fn, 'options', options ?? {});
  const quantity =
    o['quantity'] === undefined
      ? PHYSICS_DEFAULTS.arrheniusQuantity
      : requireOneOf(fn, 'options.quantity', o['quantity'], [
          'resistivity',
          'conductivity',
        ] as const);
  const m =
    o['prefactorExponent'] === undefined
      ? PHYSICS_DEFAULTS.arrheniusPrefactorExponent
      : requireFiniteNumber(fn, 'options.prefactorExponent', o['prefactorExponent']);
  const minK = o['minK'] === undefined ? 0 : requireFiniteNumber(fn, 'options.minK', o['minK']);
  const maxK =
    o['maxK'] === undefined
      ? Number.POSITIVE_INFINITY
      : requireFiniteNumber(fn, 'options.maxK', o['maxK']);
  if (minK > maxK) {
    throw new RangeError(
      `\`${fn}\` requires options.minK at most options.maxK, got ${minK} > ${maxK}`,
    );
  }
  const [temps, values] = readPoints(fn, points, ['temperatureK', 'value'], 0) as [
    Float64Array,
    Float64Array,
  ];
  let count = 0;
  for (let i = 0; i < temps.length; i++) if (temps[i]! >= minK && temps[i]! <= maxK) count++;
  if (count < 3) {
    throw new RangeError(
      `\`${fn}\` requires at least 3 points in the temperature window, got ${count}`,
    );
  }
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  const sign = quantity === 'resistivity' ? 1 : -1;
  let j = 0;
  let tMin = Number.POSITIVE_INFINITY;
  let tMax = 0;
  for (let i = 0; i < temps.length; i++) {
    const t = temps[i]!;
    if (t < minK || t > maxK) continue;
    x[j] = 1 / (BOLTZMANN_EV_PER_K * t);
    y[j] = Math.log(values[i]!) + sign * m * Math.log(t);
    tMin = Math.min(tMin, t);
    tMax = Math.max(tMax, t);
    j++;
  }
  if (tMin === tMax) {
    throw new RangeError(
      `\`${fn}\` requires at least two distinct temperatures in the window, got only ${tMin} K`,
    );
  }
  const line = fitLine(x, y);
  const ea = sign * line.slope;
  const tCritical = studentTCritical(0.95, count - 2);
  const half = tCritical * line.slopeStandardError;
  return {
    activationEnergyEv: ea,
    standardErrorEv: line.slopeStandardError,
    ci95Ev: [ea - half, ea + half],
    rSquared: line.rSquared,
    count,
    intercept: line.intercept,
    interceptStandardError: line.interceptStandardError,
    residuals: line.residuals,
    tCritical,
  };
}
