/**
 * The one result shape every fit of the library returns.
 */
import { studentTCritical } from '../numeric/student-t';

/**
 * Result of every fit (`fitArrhenius`, `fitModel`, `fitLinearTcr`, `fitBlochGruneisen`).
 *
 * Fits run on dwell-step means (see `dwellSteps`): `count` is the number of readings,
 * `stepCount` the number of steps fitted and `degreesOfFreedom` = stepCount - fitted parameters.
 * Residuals are observed minus model, one per reading in input order, always in the same unit:
 * ln(observed / model) of the fitted quantity (0.01 is one per cent above the model).
 */
export interface FitResult<P extends string> {
  /** Every parameter of the model in its own unit, fixed ones included. */
  parameters: Record<P, number>;
  /** The fitted (free) parameters, in the order of `correlation`. */
  fitted: P[];
  /** Standard errors of the fitted parameters; null when not identifiable or not converged. */
  standardErrors: Partial<Record<P, number | null>>;
  /** 95 % intervals (Student's t, `degreesOfFreedom`) of the fitted parameters; null as above. */
  confidenceIntervals95: Partial<Record<P, [number, number] | null>>;
  /**
   * Correlation matrix of the fitted parameters in `fitted` order (of their logarithms for the
   * ones fitted on a log scale); null when the covariance is not available.
   */
  correlation: number[][] | null;
  /** ln(observed / model) per reading, in input order. */
  residuals: number[];
  /** Readings used. */
  count: number;
  /** Dwell steps fitted. */
  stepCount: number;
  degreesOfFreedom: number;
  /** Weighted R² on the fitted scale, null where it is not defined (one step value, no spread). */
  rSquared: number | null;
  converged: boolean;
  /** Why the fit stopped (the convergence test met, or why none was). */
  reason: string;
  iterations: number;
  /** Student's t(0.975, degreesOfFreedom) used for the intervals. */
  tCritical: number;
  /**
   * Plain-language cautions: a relative standard error above 50 %, a parameter at a bound of
   * its range, a window that bends (Arrhenius curvature), no convergence.
   */
  warnings: string[];
}

/**
 * Plain words for every parameter the library's fits report, as their warnings name them (a
 * warning is read by people, not programs).
 */
export const FIT_PARAMETER_WORDS: Readonly<Record<string, string>> = {
  activationEnergyEv: 'the activation energy',
  intercept: 'the intercept',
  donorDensity: 'the donor density',
  acceptorDensity: 'the acceptor density',
  donorLevel: 'the donor ionization energy',
  acceptorLevel: 'the acceptor ionization energy',
  mobilityScale: 'the mobility scale',
  referenceResistivityOhmCm: 'the resistivity at the reference temperature',
  alphaPerK: 'the temperature coefficient',
  residualOhmCm: 'the residual resistivity',
  couplingOhmCm: 'the phonon coupling',
  debyeK: 'the Debye temperature',
};

/** @internal A parameter's words, capitalised to start a sentence. */
export function parameterWords(name: string): string {
  const words = FIT_PARAMETER_WORDS[name] ?? name;
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** Relative standard error above which a parameter is called poorly determined. */
export const MAX_RELATIVE_STANDARD_ERROR = 0.5;

/**
 * @internal Warnings every fit gives: no convergence, and each fitted parameter whose standard
 * error exceeds `MAX_RELATIVE_STANDARD_ERROR` of its value (or is not available).
 */
export function standardWarnings<P extends string>(
  r: Pick<FitResult<P>, 'parameters' | 'fitted' | 'standardErrors' | 'converged' | 'reason'>,
  checked: readonly P[] = r.fitted,
): string[] {
  if (!r.converged) return [`The fit did not converge (${r.reason}); no intervals are given.`];
  const out: string[] = [];
  for (const name of checked) {
    const se = r.standardErrors[name];
    const value = r.parameters[name];
    if (se === null || se === undefined) {
      out.push(`${parameterWords(name)} is not determined by the data (no standard error).`);
    } else if (se > MAX_RELATIVE_STANDARD_ERROR * Math.abs(value)) {
      const pct = value === 0 ? 'infinite' : `${((100 * se) / Math.abs(value)).toFixed(0)} %`;
      out.push(
        `${parameterWords(name)} is poorly determined: relative standard error ${pct} ` +
          '(above 50 %).',
      );
    }
  }
  return out;
}

/** @internal Correlation matrix from a covariance matrix (null when a variance is not > 0). */
export function correlationOf(covariance: number[][] | null): number[][] | null {
  if (!covariance) return null;
  const sd = covariance.map((row, i) => Math.sqrt(row[i]!));
  if (!sd.every((v) => v > 0 && Number.isFinite(v))) return null;
  return covariance.map((row, i) =>
    row.map((v, j) => Math.max(-1, Math.min(1, v / (sd[i]! * sd[j]!)))),
  );
}

/** How a fitted coordinate maps to the reported parameter. */
export type ParameterScale = 'linear' | 'log';

/**
 * @internal Standard errors and 95 % intervals of fitted coordinates q (parameter = q, or
 * exp(q) on a log scale, whose interval is exp(q ± t se) and whose se is P se(q) by the delta
 * method; a linear one may be a multiple `factors[i]` of q). `scaledCovariance` null, or `converged` false, gives null for every one: a fit that
 * has not converged stores no intervals.
 */
export function uncertaintiesOf<P extends string>(
  names: readonly P[],
  coordinates: readonly number[],
  scales: readonly ParameterScale[],
  scaledCovariance: number[][] | null,
  degreesOfFreedom: number,
  converged: boolean,
  factors?: readonly number[],
): Pick<FitResult<P>, 'standardErrors' | 'confidenceIntervals95' | 'correlation' | 'tCritical'> {
  const tCritical = degreesOfFreedom > 0 ? studentTCritical(0.95, degreesOfFreedom) : Number.NaN;
  const standardErrors: Partial<Record<P, number | null>> = {};
  const confidenceIntervals95: Partial<Record<P, [number, number] | null>> = {};
  names.forEach((name, i) => {
    const variance = scaledCovariance?.[i]?.[i];
    if (!converged || variance === undefined || !(variance >= 0) || !Number.isFinite(variance)) {
      standardErrors[name] = null;
      confidenceIntervals95[name] = null;
      return;
    }
    const se = Math.sqrt(variance);
    const q = coordinates[i]!;
    if (scales[i] === 'log') {
      standardErrors[name] = Math.exp(q) * se;
      confidenceIntervals95[name] = [Math.exp(q - tCritical * se), Math.exp(q + tCritical * se)];
    } else {
      const f = factors?.[i] ?? 1;
      standardErrors[name] = f * se;
      confidenceIntervals95[name] = [f * (q - tCritical * se), f * (q + tCritical * se)];
    }
  });
  return {
    standardErrors,
    confidenceIntervals95,
    correlation: correlationOf(scaledCovariance),
    tCritical,
  };
}

/** @internal Weighted R² = 1 - chi² / sum w (y - weighted mean)^2, null without spread. */
export function weightedRSquared(
  y: ArrayLike<number>,
  weights: ArrayLike<number>,
  chiSquare: number,
): number | null {
  let sw = 0;
  let swy = 0;
  for (let i = 0; i < y.length; i++) {
    sw += weights[i]!;
    swy += weights[i]! * y[i]!;
  }
  const mean = swy / sw;
  let total = 0;
  for (let i = 0; i < y.length; i++) total += weights[i]! * (y[i]! - mean) ** 2;
  return total > 0 && Number.isFinite(chiSquare) ? Math.max(0, 1 - chiSquare / total) : null;
}
