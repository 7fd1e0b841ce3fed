/**
 * Arrhenius fit of a thermally activated resistivity or conductivity, on dwell-step means.
 */
import { BOLTZMANN_EV_PER_K } from '../constants';
import { PHYSICS_DEFAULTS } from '../defaults';
import { invertSpd } from '../numeric/matrix';
import { requireArray, requireFiniteNumber, requireObject, requireOneOf } from '../validate';
import type { FitResult } from './fit-result';
import { standardWarnings, uncertaintiesOf, weightedRSquared } from './fit-result';
import { pointNumber, pointRecord } from './points';
import type { StepOptions } from './steps';
import { dwellStepColumns, readStepOptions } from './steps';
import { effectiveVarianceLine } from './effective-variance';

/** Options of `fitArrhenius`. */
export interface ArrheniusOptions extends StepOptions {
  /** Fitted quantity; default `PHYSICS_DEFAULTS.arrheniusQuantity` ('resistivity'). */
  quantity?: 'resistivity' | 'conductivity';
  /** Exponent m of the T^m prefactor; default `PHYSICS_DEFAULTS.arrheniusPrefactorExponent` (0). */
  prefactorExponent?: number;
  /** Lowest temperature used, K (inclusive). */
  minK?: number;
  /** Highest temperature used, K (inclusive). */
  maxK?: number;
}

/** Parameters of `fitArrhenius`: Ea in eV and the intercept a of the fitted line. */
export type ArrheniusParameter = 'activationEnergyEv' | 'intercept';

/**
 * Quadratic term c of y = a + b (x - xm) + c (x - xm)^2 over the same step means and weights
 * (x = 1 / (k T) in 1/eV, so c is in eV^2); a significant one (|t| > 3) means the window bends,
 * usually because it spans two regimes.
 */
export interface ArrheniusCurvature {
  value: number;
  standardError: number;
  /** value / standardError (0 when the steps lie exactly on the curve). */
  t: number;
  significant: boolean;
}

/** Result of `fitArrhenius`. */
export interface ArrheniusFit extends FitResult<ArrheniusParameter> {
  /** Null with fewer than 4 steps (no degree of freedom left for the quadratic). */
  curvature: ArrheniusCurvature | null;
}

/** |t| of the quadratic term above which `curvature.significant` is set. */
export const CURVATURE_T_LIMIT = 3;

/**
 * Activation energy from an Arrhenius plot over a temperature window.
 *
 * Formula (x = 1 / (k T), k in eV/K, m = prefactorExponent):
 *   resistivity:  ln(value * T^m)  = a + Ea x
 *   conductivity: ln(value * T^-m) = a - Ea x
 * so Ea > 0 for a thermally activated process either way. The readings in the window are
 * grouped into dwell steps (`dwellSteps`) and the line is fitted to the step means by weighted
 * least squares, weight 1 / variance of each mean; with `temperatureUncertaintyK` = u_T each
 * variance gains (dy/dT)^2 u_T^2, iterated to a fixed point (effective variance: J. Orear,
 * Am. J. Phys. 50, 912 (1982)). The covariance is scaled by the reduced chi-square
 * chi^2 / (steps - 2), so the scatter of the step means sets the uncertainty and repeating every
 * reading k times leaves it unchanged; the 95 % interval is Ea ± t(0.975, steps - 2) se.
 * `minK`/`maxK` are inclusive; fewer than 3 readings or 3 steps in the window is an error.
 * Residuals: ln(observed / fitted) per reading of the window, in input order.
 * Source: Press et al., Numerical Recipes, 3rd ed. (2007), sections 15.2 and 15.4.
 *
 * @param points measured { temperatureK, value } pairs (value in ohm cm or S/cm, > 0)
 * @param options quantity, prefactor exponent, window, step tolerance, temperature uncertainty
 * @example fitArrhenius([{ temperatureK: 500, value: Math.exp(0.6 / (k * 500)) }, ...])
 *   // parameters.activationEnergyEv ≈ 0.6
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
  const steps = readStepOptions(fn, o);
  // One pass over the points: check each, keep the window's, take the logarithms.
  const list = requireArray(fn, 'points', points, 0);
  // One buffer for both columns: allocating a large typed array costs more than filling it.
  const columns = new Float64Array(2 * list.length);
  const t = columns.subarray(0, list.length);
  const y = columns.subarray(list.length);
  const sign = quantity === 'resistivity' ? 1 : -1;
  let n = 0;
  for (let i = 0; i < list.length; i++) {
    const p = pointRecord(fn, list, i);
    // Named reads are fast; the checked read runs only to name a bad value.
    const rawT = p['temperatureK'];
    const rawValue = p['value'];
    const tk = isPositive(rawT) ? rawT : pointNumber(fn, p, i, 'temperatureK');
    const value = isPositive(rawValue) ? rawValue : pointNumber(fn, p, i, 'value');
    if (tk < minK || tk > maxK) continue;
    t[n] = tk;
    // m = 0 adds exactly 0: skip its logarithm.
    y[n] = m === 0 ? Math.log(value) : Math.log(value) + sign * m * Math.log(tk);
    n++;
  }
  if (n < 3) {
    throw new RangeError(
      `\`${fn}\` requires at least 3 points in the temperature window, got ${n}`,
    );
  }
  let distinct = false;
  for (let i = 1; i < n && !distinct; i++) distinct = t[i] !== t[0];
  if (!distinct) {
    throw new RangeError(
      `\`${fn}\` requires at least two distinct temperatures in the window, got only ${t[0]} K`,
    );
  }
  const grouped = dwellStepColumns(t, y, n, steps.toleranceK);
  if (grouped.length < 3) {
    throw new RangeError(
      `\`${fn}\` requires at least 3 temperature steps in the window (readings within ` +
        `options.stepToleranceK = ${steps.toleranceK} K form one step), got ${grouped.length}`,
    );
  }
  const x = new Float64Array(grouped.length);
  for (let i = 0; i < x.length; i++) x[i] = 1 / (BOLTZMANN_EV_PER_K * grouped.temperatureK[i]!);
  const line = effectiveVarianceLine(
    grouped,
    x,
    // d(residual)/dT of y - (a + b x): the prefactor term m/T and the model's b / (k T^2).
    (b, tk) => (sign * m) / tk + b / (BOLTZMANN_EV_PER_K * tk * tk),
    steps.temperatureUncertaintyK,
  );
  const dof = grouped.length - 2;
  const s2 = line.chiSquare / dof;
  const ea = sign * line.slope;
  const cov = line.unscaledCovariance?.map((row) => row.map((v) => v * s2)) ?? null;
  // Coordinates [Ea, intercept]: var(Ea) = var(b); cov(Ea, a) = sign cov(b, a).
  const scaled = cov
    ? [
        [cov[1]![1]!, sign * cov[1]![0]!],
        [sign * cov[0]![1]!, cov[0]![0]!],
      ]
    : null;
  const u = uncertaintiesOf<ArrheniusParameter>(
    ['activationEnergyEv', 'intercept'],
    [ea, line.intercept],
    ['linear', 'linear'],
    scaled,
    dof,
    line.converged,
  );
  const residuals = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    residuals[i] = y[i]! - (line.intercept + line.slope / (BOLTZMANN_EV_PER_K * t[i]!));
  }
  const curvature = curvatureOf(grouped.mean, x, line.weights);
  const result: ArrheniusFit = {
    parameters: { activationEnergyEv: ea, intercept: line.intercept },
    fitted: ['activationEnergyEv', 'intercept'],
    ...u,
    residuals,
    count: n,
    stepCount: grouped.length,
    degreesOfFreedom: dof,
    rSquared: weightedRSquared(grouped.mean, line.weights, line.chiSquare),
    converged: line.converged,
    reason: line.reason,
    iterations: line.iterations,
    curvature,
    warnings: [],
  };
  result.warnings = standardWarnings(result, ['activationEnergyEv']);
  if (curvature?.significant) {
    result.warnings.push(
      `ln(value) bends against 1/T across the window (quadratic term t = ` +
        `${curvature.t.toFixed(1)}, |t| > ${CURVATURE_T_LIMIT}): it probably spans two regimes.`,
    );
  }
  return result;
}

function isPositive(v: unknown): v is number {
  return typeof v === 'number' && v > 0 && v < Number.POSITIVE_INFINITY;
}

function curvatureOf(
  y: Float64Array,
  x: Float64Array,
  weights: Float64Array,
): ArrheniusCurvature | null {
  if (y.length < 4) return null;
  let xm = 0;
  for (let i = 0; i < x.length; i++) xm += x[i]!;
  xm /= x.length;
  // Weighted least squares on the rows [1, x - xm, (x - xm)^2], normal equations summed in one
  // pass (Press et al., Numerical Recipes, 3rd ed., section 15.4).
  const a = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  const rhs = [0, 0, 0];
  const row = [1, 0, 0];
  for (let i = 0; i < y.length; i++) {
    const w = weights[i]!;
    row[1] = x[i]! - xm;
    row[2] = row[1] ** 2;
    for (let p = 0; p < 3; p++) {
      rhs[p] = rhs[p]! + w * row[p]! * y[i]!;
      for (let q = 0; q <= p; q++) a[p]![q] = a[p]![q]! + w * row[p]! * row[q]!;
    }
  }
  for (let p = 0; p < 3; p++) for (let q = p + 1; q < 3; q++) a[p]![q] = a[q]![p]!;
  const inv = invertSpd(a);
  if (!inv) return null;
  const c = inv.map((r) => r[0]! * rhs[0]! + r[1]! * rhs[1]! + r[2]! * rhs[2]!);
  let chiSquare = 0;
  for (let i = 0; i < y.length; i++) {
    const d = x[i]! - xm;
    const r = y[i]! - (c[0]! + c[1]! * d + c[2]! * d ** 2);
    chiSquare += weights[i]! * r * r;
  }
  const value = c[2]!;
  const standardError = Math.sqrt((inv[2]![2]! * chiSquare) / (y.length - 3));
  const tValue = standardError > 0 ? value / standardError : 0;
  return {
    value,
    standardError,
    t: tValue,
    significant: Math.abs(tValue) > CURVATURE_T_LIMIT,
  };
}
