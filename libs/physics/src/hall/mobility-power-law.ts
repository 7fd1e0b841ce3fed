/**
 * Power law of the Hall mobility against temperature, on dwell-step means.
 */
import { effectiveVarianceLine } from '../fit/effective-variance';
import type { FitResult } from '../fit/fit-result';
import { standardWarnings, uncertaintiesOf, weightedRSquared } from '../fit/fit-result';
import { readPoints } from '../fit/points';
import type { StepOptions } from '../fit/steps';
import { dwellStepColumns, readStepOptions } from '../fit/steps';
import { requireObject } from '../validate';
import { temperatureWindow } from './window';

/** Parameters of `fitMobilityPowerLaw`: the exponent and mu at 300 K, cm^2/(V s). */
export type MobilityPowerLawParameter = 'exponent' | 'mobilityAt300K';

/** Options of `fitMobilityPowerLaw`: a temperature window (K, inclusive) and the step options. */
export interface MobilityPowerLawOptions extends StepOptions {
  minK?: number;
  maxK?: number;
}

/**
 * Result of `fitMobilityPowerLaw`: the shared `FitResult` (residuals ln(mu / model)) with the
 * exponent's figures also at the top level.
 */
export interface MobilityPowerLawFit extends FitResult<MobilityPowerLawParameter> {
  exponent: number;
  /** Standard error of the exponent (null in `standardErrors` means not converged; here NaN). */
  standardError: number;
  /** 95 % interval of the exponent (Student's t at stepCount - 2). */
  ci95: [number, number];
  mobilityAt300K: number;
  rSquared: number;
}

/**
 * Exponent of mu(T) = mu_300 (T / 300)^exponent.
 *
 * Method: the straight line ln mu = ln mu_300 + exponent ln(T / 300) through the dwell-step
 * means of ln mu (`dwellSteps`) by weighted least squares (weights 1 / variance of each mean,
 * plus (exponent / T)^2 u_T^2 with `temperatureUncertaintyK`, Orear 1982), covariance scaled by
 * chi^2 / (steps - 2), intervals with Student's t; mu_300 has a log-scale interval.
 * A negative exponent near -1.5 points to acoustic phonons (-2.2 to -2.6 in silicon, where
 * optical phonons join in; Morin & Maita, Phys. Rev. 96, 28 (1954)), a positive one near +1.5
 * to ionized impurities (Conwell & Weisskopf 1950).
 * Assumptions: one scattering mechanism dominates in the window; the Hall factor is constant.
 *
 * @param points measured { temperatureK, mobility } (mobility cm^2/(V s), > 0), 3 steps or more
 * @param options window (minK, maxK) and step options
 * @example fitMobilityPowerLaw([100, 150, 200, 300].map((t) =>
 *   ({ temperatureK: t, mobility: 1000 * (t / 300) ** -2.4 }))).exponent // -2.4
 */
export function fitMobilityPowerLaw(
  points: Array<{ temperatureK: number; mobility: number }>,
  options: MobilityPowerLawOptions = {},
): MobilityPowerLawFit {
  const fn = 'fitMobilityPowerLaw';
  const o = requireObject(fn, 'options', options ?? {});
  const stepOptions = readStepOptions(fn, o);
  const [allT, allMu] = readPoints(fn, points, ['temperatureK', 'mobility'], 1) as [
    Float64Array,
    Float64Array,
  ];
  const keep = temperatureWindow(fn, o, allT);
  const temps = keep.map((i) => allT[i]!);
  const mus = keep.map((i) => allMu[i]!);
  const lnMu = mus.map(Math.log);
  const steps = dwellStepColumns(temps, lnMu, temps.length, stepOptions.toleranceK);
  if (steps.length < 3) {
    throw new RangeError(
      `\`${fn}\` requires at least 3 temperature steps in the window (readings within ` +
        `options.stepToleranceK = ${stepOptions.toleranceK} K form one step), got ${steps.length}`,
    );
  }
  const line = effectiveVarianceLine(
    steps,
    steps.temperatureK.map((t) => Math.log(t / 300)),
    (b, t) => -b / t,
    stepOptions.temperatureUncertaintyK,
  );
  const dof = steps.length - 2;
  const s2 = line.chiSquare / dof;
  const cov = line.unscaledCovariance?.map((row) => row.map((v) => v * s2)) ?? null;
  // Reported order: exponent (linear), ln mu_300 (log); the line's order is [intercept, slope].
  const swapped = cov
    ? [
        [cov[1]![1]!, cov[1]![0]!],
        [cov[0]![1]!, cov[0]![0]!],
      ]
    : null;
  const u = uncertaintiesOf<MobilityPowerLawParameter>(
    ['exponent', 'mobilityAt300K'],
    [line.slope, line.intercept],
    ['linear', 'log'],
    swapped,
    dof,
    line.converged,
  );
  const mu300 = Math.exp(line.intercept);
  const rSquared = weightedRSquared(steps.mean, line.weights, line.chiSquare);
  const result: MobilityPowerLawFit = {
    parameters: { exponent: line.slope, mobilityAt300K: mu300 },
    fitted: ['exponent', 'mobilityAt300K'],
    ...u,
    residuals: temps.map((t, i) => lnMu[i]! - line.intercept - line.slope * Math.log(t / 300)),
    count: temps.length,
    stepCount: steps.length,
    degreesOfFreedom: dof,
    rSquared: rSquared ?? 0,
    converged: line.converged,
    reason: line.reason,
    iterations: line.iterations,
    warnings: [],
    exponent: line.slope,
    standardError: u.standardErrors.exponent ?? Number.NaN,
    ci95: u.confidenceIntervals95.exponent ?? [Number.NaN, Number.NaN],
    mobilityAt300K: mu300,
  };
  result.warnings = standardWarnings(result);
  return result;
}
