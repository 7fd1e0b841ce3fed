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
  const c = dwellStepColumns(temperaturesK, y, temperaturesK.length, toleranceK);
  return Array.from({ length: c.length }, (_, i) => ({
    temperatureK: c.temperatureK[i]!,
    mean: c.mean[i]!,
    varianceOfMean: c.varianceOfMean[i]!,
    count: c.count[i]!,
  }));
}

/** @internal Dwell steps as parallel typed arrays (`length` of each used). */
export interface DwellStepColumns {
  length: number;
  temperatureK: Float64Array;
  mean: Float64Array;
  varianceOfMean: Float64Array;
  count: Float64Array;
}

/**
 * @internal `dwellSteps` over the first `n` readings, into typed arrays with no object per step
 * (the same arithmetic: `dwellSteps` is built on it). A first pass counts the steps so that
 * the arrays hold steps, not readings: a large typed array costs more to allocate than a pass.
 */
export function dwellStepColumns(
  temperaturesK: ArrayLike<number>,
  y: ArrayLike<number>,
  n: number,
  toleranceK: number,
): DwellStepColumns {
  let length = 0;
  for (let i = 0; i < n; length++) i = stepEnd(temperaturesK, i, n, toleranceK);
  const temperatureK = new Float64Array(length);
  const mean = new Float64Array(length);
  const ssOf = new Float64Array(length);
  const count = new Float64Array(length);
  let pooledSs = 0;
  let pooledDof = 0;
  for (let s = 0, i = 0; s < length; s++) {
    const end = stepEnd(temperaturesK, i, n, toleranceK);
    let st = 0;
    let sy = 0;
    for (let j = i; j < end; j++) {
      st += temperaturesK[j]!;
      sy += y[j]!;
    }
    const k = end - i;
    const m = sy / k;
    let ss = 0;
    for (let j = i; j < end; j++) ss += (y[j]! - m) ** 2;
    temperatureK[s] = st / k;
    mean[s] = m;
    ssOf[s] = ss;
    count[s] = k;
    pooledSs += ss;
    pooledDof += k - 1;
    i = end;
  }
  const pooled = pooledDof > 0 ? pooledSs / pooledDof : 0;
  const varianceOfMean = new Float64Array(length);
  for (let s = 0; s < length; s++) {
    const k = count[s]!;
    const own = k > 1 ? ssOf[s]! / (k - 1) : 0;
    const variance = own > 0 ? own : pooled;
    varianceOfMean[s] = pooled > 0 ? variance / k : 1;
  }
  return { length, temperatureK, mean, varianceOfMean, count };
}

/** The index after the step that starts at reading i. */
function stepEnd(temperaturesK: ArrayLike<number>, i: number, n: number, toleranceK: number) {
  const first = temperaturesK[i]!;
  let end = i + 1;
  while (end < n && Math.abs(temperaturesK[end]! - first) <= toleranceK) end++;
  return end;
}
