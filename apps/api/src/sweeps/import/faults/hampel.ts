/**
 * The Hampel filter: a reading further from its neighbours' median than a few scaled median
 * absolute deviations is an outlier. Robust: the bound is not widened by the outlier itself.
 * Source: F. R. Hampel, J. Am. Stat. Assoc. 69, 383 (1974); as a moving-window filter, R. K.
 * Pearson, Mining Imperfect Data (SIAM, 2005), ch. 4. Scale 1.4826 makes the MAD a standard
 * deviation for normal noise. On a ramp the window's own trend would widen the MAD (a 7-point
 * window of a steep ln rho curve spans far more than its noise), so each window is first
 * detrended by its Theil–Sen line against temperature (H. Theil 1950; P. K. Sen, J. Am. Stat.
 * Assoc. 63, 1379 (1968)), itself robust to the outlier; the filter then judges the residuals.
 * A MAD from 7 readings is itself a rough estimate (often half the true spread), which on clean
 * noise flags a reading every few dozen; so the spread is never taken below the whole sweep's
 * robust scatter of one reading (`readingScatter`), given as `floor`. Common practice, no
 * source: the demo sweeps (0.2 to 0.5 % noise) drew 2 to 5 false outliers each without it.
 */

/** Readings each side of the one judged (window 7). */
export const HAMPEL_HALF_WINDOW = 3;
/** Scaled MADs beyond the median that make an outlier. */
export const HAMPEL_THRESHOLD = 4;
/** MAD to standard deviation for normal noise, 1 / Phi^-1(3/4). */
export const MAD_SCALE = 1.4826;
/**
 * Smallest spread the bound uses, in the filtered quantity (1e-4 in ln rho: 0.01 %). Common
 * practice, no source: values quantised by the file's digits can have a MAD of exactly zero,
 * and a reading one digit off is not an outlier.
 */
export const HAMPEL_MIN_SPREAD = 1e-4;

/** An outlier: its position, the trend's value there and the spread it was judged by. */
export interface HampelOutlier {
  index: number;
  median: number;
  scaledMad: number;
}

/** Most readings in a window, and most pairs among them. */
const WINDOW = 2 * HAMPEL_HALF_WINDOW + 1;
/**
 * Scratch for one window at a time (the filter is synchronous): a 100,000-reading sweep
 * allocated five arrays per reading before, a fifth of its upload.
 */
const slopes = new Float64Array((WINDOW * (WINDOW - 1)) / 2);
const residuals = new Float64Array(WINDOW);
const deviations = new Float64Array(WINDOW);

/**
 * Median of the first n values of `buffer`, sorted in place by insertion (the scratch is reused;
 * for the at most 21 values of a window this beats a typed sort, which a subarray view costs).
 */
function median(buffer: Float64Array, n: number): number {
  for (let i = 1; i < n; i++) {
    const v = buffer[i]!;
    let j = i - 1;
    while (j >= 0 && buffer[j]! > v) {
      buffer[j + 1] = buffer[j]!;
      j--;
    }
    buffer[j + 1] = v;
  }
  const m = n >> 1;
  return n % 2 ? buffer[m]! : (buffer[m - 1]! + buffer[m]!) / 2;
}

/** Theil–Sen slope of y on x over positions[from..to) (0 if x never moves). */
function theilSenSlope(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  positions: number[],
  from: number,
  to: number,
): number {
  let count = 0;
  for (let a = from; a < to; a++) {
    for (let b = a + 1; b < to; b++) {
      const dx = x[positions[b]!]! - x[positions[a]!]!;
      if (Math.abs(dx) > 1e-9) slopes[count++] = (y[positions[b]!]! - y[positions[a]!]!) / dx;
    }
  }
  return count ? median(slopes, count) : 0;
}

/**
 * Outliers among `values` (against `x`, the temperatures) over the series `positions` (in
 * order: one current level within one leg, so like is judged against like). At the ends the
 * window is cut short; a window of fewer than 5 readings judges nothing. `median` in the result
 * is the value the window's trend expects at the point.
 */
export function hampelOutliers(
  x: ArrayLike<number>,
  values: ArrayLike<number>,
  positions: number[],
  floor = HAMPEL_MIN_SPREAD,
): HampelOutlier[] {
  const least = Math.max(floor, HAMPEL_MIN_SPREAD);
  const found: HampelOutlier[] = [];
  const n = positions.length;
  for (let k = 0; k < n; k++) {
    const i = positions[k]!;
    const from = Math.max(0, k - HAMPEL_HALF_WINDOW);
    const to = Math.min(n, k + HAMPEL_HALF_WINDOW + 1);
    const size = to - from;
    if (size < 5) continue;
    const slope = theilSenSlope(x, values, positions, from, to);
    for (let w = 0; w < size; w++) {
      const j = positions[from + w]!;
      residuals[w] = values[j]! - slope * (x[j]! - x[i]!);
    }
    const med = median(residuals, size);
    for (let w = 0; w < size; w++) deviations[w] = Math.abs(residuals[w]! - med);
    const scaledMad = MAD_SCALE * median(deviations, size);
    const bound = HAMPEL_THRESHOLD * Math.max(scaledMad, least);
    if (Math.abs(values[i]! - med) > bound) {
      found.push({ index: i, median: med, scaledMad: Math.max(scaledMad, least) });
    }
  }
  return found;
}
