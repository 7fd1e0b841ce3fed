/**
 * Arrhenius fit of a thermally activated resistivity or conductivity, on dwell-step means.
 */
import { BOLTZMANN_EV_PER_K } from '../constants';
import { PHYSICS_DEFAULTS } from '../defaults';
import { weightedLeastSquares } from '../numeric/weighted-least-squares';
import { requireFiniteNumber, requireObject, requireOneOf } from '../validate';
import type { FitResult } from './fit-result';
import { standardWarnings, uncertaintiesOf, weightedRSquared } from './fit-result';
import { readPoints } from './points';
import type { StepOptions } from './steps';
import { dwellSteps, readStepOptions } from './steps';
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
  const [temps, values] = readPoints(fn, points, ['temperatureK', 'value'], 0) as [
    Float64Array,
    Float64Array,
  ];
  const t: number[] = [];
  const y: number[] = [];
  const sign = quantity === 'resistivity' ? 1 : -1;
  for (let i = 0; i < temps.length; i++) {
    const tk = temps[i]!;
    if (tk < minK || tk > maxK) continue;
    t.push(tk);
    y.push(Math.log(values[i]!) + sign * m * Math.log(tk));
  }
  if (t.length < 3) {
    throw new RangeError(
      `\`${fn}\` requires at least 3 points in the temperature window, got ${t.length}`,
    );
  }
  if (t.every((v) => v === t[0])) {
    throw new RangeError(
      `\`${fn}\` requires at least two distinct temperatures in the window, got only ${t[0]} K`,
    );
  }
  const grouped = dwellSteps(t, y, steps.toleranceK);
  if (grouped.length < 3) {
    throw new RangeError(
      `\`${fn}\` requires at least 3 temperature steps in the window (readings within ` +
        `options.stepToleranceK = ${steps.toleranceK} K form one step), got ${grouped.length}`,
    );
  }
  const x = grouped.map((s) => 1 / (BOLTZMANN_EV_PER_K * s.temperatureK));
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
  const residuals = t.map(
    (tk, i) => y[i]! - (line.intercept + line.slope / (BOLTZMANN_EV_PER_K * tk)),
  );
  const curvature = curvatureOf(
    grouped.map((s) => s.mean),
    x,
    line.weights,
  );
  const result: ArrheniusFit = {
    parameters: { activationEnergyEv: ea, intercept: line.intercept },
    fitted: ['activationEnergyEv', 'intercept'],
    ...u,
    residuals,
    count: t.length,
    stepCount: grouped.length,
    degreesOfFreedom: dof,
    rSquared: weightedRSquared(
      grouped.map((s) => s.mean),
      line.weights,
      line.chiSquare,
    ),
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

function curvatureOf(
  y: readonly number[],
  x: readonly number[],
  weights: readonly number[],
): ArrheniusCurvature | null {
  if (y.length < 4) return null;
  const xm = x.reduce((s, v) => s + v, 0) / x.length;
  const q = weightedLeastSquares(
    x.map((v) => [1, v - xm, (v - xm) ** 2]),
    y,
    weights,
  );
  if (!q.unscaledCovariance) return null;
  const value = q.coefficients[2]!;
  const standardError = Math.sqrt((q.unscaledCovariance[2]![2]! * q.chiSquare) / (y.length - 3));
  const tValue = standardError > 0 ? value / standardError : 0;
  return {
    value,
    standardError,
    t: tValue,
    significant: Math.abs(tValue) > CURVATURE_T_LIMIT,
  };
}
