/**
 * Dwell steps: the readings a station records while it holds one temperature.
 */
import { PHYSICS_DEFAULTS } from '../defaults';
import { requireNonNegative } from '../validate';

/** Options every fit takes for its dwell steps. */
export interface StepOptions {
  /**
   * Consecutive readings within this of a step's first reading form one step, K; default
   * `PHYSICS_DEFAULTS.fitStepToleranceK` (0.5 K). 0 makes every distinct temperature a step.
   */
  stepToleranceK?: number;
  /**
   * Standard uncertainty of each step's temperature, K (the same for every step); adds the
   * effective variance (d residual / dT)^2 u_T^2 (Orear 1982). Default
   * `PHYSICS_DEFAULTS.fitTemperatureUncertaintyK` (0).
   */
  temperatureUncertaintyK?: number;
}

/** One dwell step of a fitted quantity y (ln rho, or rho for the linear TCR). */
export interface DwellStep {
  /** Mean temperature of the step's readings, K. */
  temperatureK: number;
  /** Mean of y over the step's readings. */
  mean: number;
  /** Variance of that mean (see `dwellSteps`); 1 when no within-step scatter is known. */
  varianceOfMean: number;
  /** Readings in the step. */
  count: number;
}

/** @internal Reads `stepToleranceK` and `temperatureUncertaintyK` from an options object. */
export function readStepOptions(
  fn: string,
  o: Record<string, unknown>,
): { toleranceK: number; temperatureUncertaintyK: number } {
  return {
    toleranceK:
      o['stepToleranceK'] === undefined
        ? PHYSICS_DEFAULTS.fitStepToleranceK
        : requireNonNegative(fn, 'options.stepToleranceK', o['stepToleranceK']),
    temperatureUncertaintyK:
      o['temperatureUncertaintyK'] === undefined
        ? PHYSICS_DEFAULTS.fitTemperatureUncertaintyK
        : requireNonNegative(fn, 'options.temperatureUncertaintyK', o['temperatureUncertaintyK']),
  };
}

/**
 * Groups consecutive readings into dwell steps and gives each step's mean and the variance of
 * that mean.
 *
 * A reading joins the current step when its temperature lies within `toleranceK` of the step's
 * first reading (inclusive); otherwise it starts a new step. The variance of a step mean is
 * s_i^2 / n_i with s_i^2 the step's sample variance; a step with one reading (or no scatter)
 * takes the pooled within-step variance s_p^2 = sum (n_i - 1) s_i^2 / sum (n_i - 1) instead.
 * With no within-step scatter anywhere every variance is 1: the fits scale their covariance by
 * the reduced chi-square, so only ratios of these variances matter (equal weights then).
 * Why: the readings of one step share its temperature error, so they are not independent; a fit
 * over readings counts one step n_i times and its interval shrinks by about sqrt(n_i).
 * Source: weighted means and pooled variance as in Bevington & Robinson, Data Reduction and
 * Error Analysis, 3rd ed. (2003), sections 4.1 and 6.3.
 *
 * @param temperaturesK reading temperatures in the order recorded, K
 * @param y the fitted quantity of each reading
 * @param toleranceK step tolerance, K (>= 0)
 * @example dwellSteps([300, 300.1, 310], [1, 1.2, 2], 0.5).length // 2
 */
export function dwellSteps(
  temperaturesK: ArrayLike<number>,
  y: ArrayLike<number>,
  toleranceK: number,
): DwellStep[] {
  const raw: Array<{ t: number; mean: number; ss: number; n: number }> = [];
  let i = 0;
  while (i < temperaturesK.length) {
    const first = temperaturesK[i]!;
    let end = i + 1;
    while (end < temperaturesK.length && Math.abs(temperaturesK[end]! - first) <= toleranceK) {
      end++;
    }
    let st = 0;
    let sy = 0;
    for (let j = i; j < end; j++) {
      st += temperaturesK[j]!;
      sy += y[j]!;
    }
    const n = end - i;
    const mean = sy / n;
    let ss = 0;
    for (let j = i; j < end; j++) ss += (y[j]! - mean) ** 2;
    raw.push({ t: st / n, mean, ss, n });
    i = end;
  }
  let pooledSs = 0;
  let pooledDof = 0;
  for (const s of raw) {
    pooledSs += s.ss;
    pooledDof += s.n - 1;
  }
  const pooled = pooledDof > 0 ? pooledSs / pooledDof : 0;
  return raw.map((s) => {
    const own = s.n > 1 ? s.ss / (s.n - 1) : 0;
    const variance = own > 0 ? own : pooled;
    return {
      temperatureK: s.t,
      mean: s.mean,
      varianceOfMean: pooled > 0 ? variance / s.n : 1,
      count: s.n,
    };
  });
}
