/**
 * Conformity decisions with guard bands (JCGM 106:2012, The role of measurement uncertainty in
 * conformity assessment).
 */
import { requireFiniteNumber, requireNonNegative } from '../validate';

/** Outcome of a guard-banded conformity decision. */
export type ConformityVerdict = 'pass' | 'fail' | 'indeterminate';

/**
 * Decides conformity of a measured value with tolerance limits when the value has an expanded
 * uncertainty U, using guard bands of width U on each limit (JCGM 106:2012, 8.3: guarded
 * acceptance and guarded rejection).
 *
 * Rule: `pass` when the whole interval [value - U, value + U] lies within [lsl, usl]; `fail`
 * when it lies wholly outside (beyond a limit); `indeterminate` when it straddles a limit.
 * A missing limit (null) is not checked. Limits are inclusive: a value exactly U inside a limit
 * passes; an interval that only touches a limit from outside is indeterminate.
 *
 * @param value the measured value
 * @param expandedUncertainty U >= 0, same unit
 * @param lsl lower limit or null
 * @param usl upper limit or null
 * @returns 'pass' | 'fail' | 'indeterminate'
 * @example guardBandedVerdict(10.0, 0.3, 9, 10.2) // 'indeterminate'
 */
export function guardBandedVerdict(
  value: number,
  expandedUncertainty: number,
  lsl: number | null,
  usl: number | null,
): ConformityVerdict {
  const fn = 'guardBandedVerdict';
  const v = requireFiniteNumber(fn, 'value', value);
  const u = requireNonNegative(fn, 'expandedUncertainty', expandedUncertainty);
  const low = lsl === null ? null : requireFiniteNumber(fn, 'lsl', lsl);
  const high = usl === null ? null : requireFiniteNumber(fn, 'usl', usl);
  if (low !== null && high !== null && low > high) {
    throw new RangeError(`\`${fn}\` requires lsl (${low}) not above usl (${high})`);
  }
  if ((low !== null && v + u < low) || (high !== null && v - u > high)) return 'fail';
  if ((low !== null && v - u < low) || (high !== null && v + u > high)) return 'indeterminate';
  return 'pass';
}
