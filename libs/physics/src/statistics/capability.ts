/**
 * Process performance against specification limits from a sample of parts.
 */
import { requireArray, requireFiniteNumber, requirePositive } from '../validate';

/** One-sided 95 % standard normal quantile, z(0.95). */
export const Z_ONE_SIDED_95 = 1.6448536269514722;

/** Fewest values `processPerformance` computes Ppk from. */
export const MIN_PPK_SAMPLE = 5;

/** Below this many values the answer carries a note that the bound is wide. */
export const SMALL_PPK_SAMPLE = 25;

/**
 * Approximate lower confidence bound of a capability index estimated from n values.
 *
 * Formula: C_lower = C - z sqrt(1 / (9 n) + C^2 / (2 (n - 1)))
 * (Bissell 1990, "How reliable is your capability index?", Appl. Statist. 39, 331-340), with
 * z = 1.645 for a one-sided 95 % bound. Assumes normally distributed, independent values.
 *
 * @param index C, the estimated index (Cpk or Ppk)
 * @param n number of values (>= 2)
 * @param z standard normal quantile, default `Z_ONE_SIDED_95`
 * @returns the lower bound (may be negative)
 * @example bissellLowerBound(1.33, 10) // 0.786
 */
export function bissellLowerBound(index: number, n: number, z = Z_ONE_SIDED_95): number {
  const fn = 'bissellLowerBound';
  const c = requireFiniteNumber(fn, 'index', index);
  const count = requireFiniteNumber(fn, 'n', n);
  if (!Number.isInteger(count) || count < 2) {
    throw new RangeError(`\`${fn}\` requires n to be an integer of at least 2, got ${count}`);
  }
  const q = requirePositive(fn, 'z', z);
  return c - q * Math.sqrt(1 / (9 * count) + (c * c) / (2 * (count - 1)));
}

/** Ppk of a sample, or why there is none. */
export interface ProcessPerformance {
  n: number;
  mean: number | null;
  /** Sample (n - 1) standard deviation, the overall spread. */
  standardDeviation: number | null;
  ppk: number | null;
  /** One-sided 95 % lower bound of Ppk (Bissell 1990). */
  ppkLower95: number | null;
  /** Why ppk is null, when it is. */
  reason: string | null;
  /** A caution that stands beside a value (few values), or null. */
  note: string | null;
}

/**
 * Process performance index Ppk of a sample against specification limits, from the overall
 * (long-term) spread of the values, with its one-sided 95 % lower bound.
 *
 * Formula: Ppk = min(USL - mean, mean - LSL) / (3 s), s the sample standard deviation (n - 1);
 * with one limit, only that side. Ppk uses the overall spread; Cpk would use the within-subgroup
 * (short-term) spread, which a single value per part does not give (ISO 22514-4:2016, from
 * memory; AIAG SPC manual, 2nd ed., from memory).
 * The lower bound is `bissellLowerBound` (Bissell 1990). Null, with a reason, below
 * `MIN_PPK_SAMPLE` values, without limits, or when s = 0; a note below `SMALL_PPK_SAMPLE`.
 *
 * @param values the measured values (finite)
 * @param lsl lower specification limit or null
 * @param usl upper specification limit or null
 * @param what how the reason and note name the values (default 'values'), e.g. 'wafers'
 * @returns n, mean, s, ppk, ppkLower95, reason, note
 * @example processPerformance([9.8, 10.1, 10.0, 9.9, 10.2], 9, 11).ppk // 2.108
 */
export function processPerformance(
  values: readonly number[],
  lsl: number | null,
  usl: number | null,
  what = 'values',
): ProcessPerformance {
  const fn = 'processPerformance';
  const list = requireArray(fn, 'values', values).map((v, i) =>
    requireFiniteNumber(fn, `values[${i}]`, v),
  );
  const low = lsl === null ? null : requireFiniteNumber(fn, 'lsl', lsl);
  const high = usl === null ? null : requireFiniteNumber(fn, 'usl', usl);
  if (low !== null && high !== null && low > high) {
    throw new RangeError(`\`${fn}\` requires lsl (${low}) not above usl (${high})`);
  }
  const n = list.length;
  const mean = n > 0 ? list.reduce((a, b) => a + b, 0) / n : null;
  const sd =
    n >= 2 && mean !== null
      ? Math.sqrt(list.reduce((a, v) => a + (v - mean) ** 2, 0) / (n - 1))
      : null;
  const none = (reason: string): ProcessPerformance => ({
    n,
    mean,
    standardDeviation: sd,
    ppk: null,
    ppkLower95: null,
    reason,
    note: null,
  });
  if (low === null && high === null) return none('There are no specification limits');
  if (n < MIN_PPK_SAMPLE) {
    return none(`Ppk needs at least ${MIN_PPK_SAMPLE} ${what}; there are ${n}`);
  }
  if (sd === null || mean === null || sd === 0) {
    return none('All values are equal; the standard deviation is 0');
  }
  const sides: number[] = [];
  if (high !== null) sides.push(high - mean);
  if (low !== null) sides.push(mean - low);
  const ppk = Math.min(...sides) / (3 * sd);
  return {
    n,
    mean,
    standardDeviation: sd,
    ppk,
    ppkLower95: bissellLowerBound(ppk, n),
    reason: null,
    note:
      n < SMALL_PPK_SAMPLE
        ? `Only ${n} ${what} (fewer than ${SMALL_PPK_SAMPLE}): Ppk is uncertain; read its lower bound`
        : null,
  };
}
