/**
 * The scatter of single readings of ln rho, and current levels at a step: what the self-heating
 * and settling checks compare a difference with.
 */
import { MAD_SCALE } from './hampel';

/** Median of `values`, sorted in place (a typed array sorts numerically without a comparator). */
function median(values: Float64Array): number {
  const s = values.sort();
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/**
 * Standard deviation of one reading of `values` (ln rho), from the second differences of each
 * series (a series: one current level within one leg, in stored order). For a smooth curve
 * sampled closely, x[i+1] - 2 x[i] + x[i-1] is noise with variance 6 sigma^2; the scaled MAD of
 * those differences is robust to the few that straddle a step or a fault. Source: the
 * difference-based variance estimator of J. von Neumann et al., Ann. Math. Stat. 12, 153 (1941),
 * in its second-difference form (P. Hall, J. W. Kay, D. M. Titterington, Biometrika 77, 521
 * (1990)). Null with fewer than 3 second differences.
 */
export function readingScatter(values: ArrayLike<number>, series: number[][]): number | null {
  let count = 0;
  for (const s of series) count += Math.max(0, s.length - 2);
  if (count < 3) return null;
  const d2 = new Float64Array(count);
  let n = 0;
  for (const s of series) {
    for (let k = 1; k + 1 < s.length; k++) {
      d2[n++] = values[s[k + 1]!]! - 2 * values[s[k]!]! + values[s[k - 1]!]!;
    }
  }
  const m = median(d2);
  for (let k = 0; k < count; k++) d2[k] = Math.abs(d2[k]! - m);
  return (MAD_SCALE * median(d2)) / Math.sqrt(6);
}

/** Two currents more than this ratio apart are different current levels. */
export const CURRENT_LEVEL_RATIO = 1.5;

/**
 * The readings of one step split by current: `low` within 20 % of the smallest current, `high`
 * within 20 % of the largest, when the two differ by `CURRENT_LEVEL_RATIO` or more; else all
 * readings are one level (`high` empty). Positions without a current count as one level.
 */
export function currentLevels(
  currentsA: ArrayLike<number>,
  start: number,
  end: number,
): { low: number[]; high: number[] } {
  const all: number[] = [];
  for (let i = start; i < end; i++) all.push(i);
  const known = all.filter((i) => Number.isFinite(currentsA[i]!));
  if (known.length < all.length || known.length < 2) return { low: all, high: [] };
  const abs = (i: number) => Math.abs(currentsA[i]!);
  // A loop, not Math.min(...): a long dwell at one temperature can hold 200,000 readings, past
  // the number of arguments a call may take.
  let min = Number.POSITIVE_INFINITY;
  let max = 0;
  for (const i of known) {
    const a = abs(i);
    if (a < min) min = a;
    if (a > max) max = a;
  }
  if (max < CURRENT_LEVEL_RATIO * min) return { low: all, high: [] };
  return {
    low: known.filter((i) => abs(i) <= 1.2 * min),
    high: known.filter((i) => abs(i) >= max / 1.2),
  };
}

/** Mean of `values` at `positions`. */
export function meanAt(values: ArrayLike<number>, positions: number[]): number {
  let s = 0;
  for (const i of positions) s += values[i]!;
  return s / positions.length;
}
