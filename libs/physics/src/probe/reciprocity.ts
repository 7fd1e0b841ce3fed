/**
 * The reciprocity check of a van der Pauw measurement: a four-terminal resistance read with the
 * current and voltage contacts swapped must not change.
 */
import { requirePositive } from '../validate';

/**
 * Relative difference of a four-terminal resistance and its reciprocal reading.
 *
 * Formula: d = |R_AB,CD - R_CD,AB| / ((R_AB,CD + R_CD,AB) / 2).
 * Assumptions: by the reciprocity theorem of linear passive networks R_AB,CD = R_CD,AB for any
 * sample shape (van der Pauw, Philips Res. Rep. 13, 1, 1958); a difference beyond the readings'
 * noise points to a non-ohmic (rectifying) or badly placed contact, or a sample heated unevenly.
 * ASTM F76 compares the two readings of each configuration for this reason; a difference above
 * a few per cent is a contact fault by common practice.
 * Source: L. J. van der Pauw, Philips Res. Rep. 13, 1 (1958); ASTM F76.
 *
 * @param resistanceOhm R_AB,CD (current A to B, voltage across C, D), ohm, above 0
 * @param reciprocalOhm R_CD,AB (current C to D, voltage across A, B), ohm, above 0
 * @returns the relative difference, dimensionless (0.02 is 2 %)
 * @example reciprocityDifference(100, 103) // 0.029557
 */
export function reciprocityDifference(resistanceOhm: number, reciprocalOhm: number): number {
  const fn = 'reciprocityDifference';
  const r = requirePositive(fn, 'resistanceOhm', resistanceOhm);
  const rr = requirePositive(fn, 'reciprocalOhm', reciprocalOhm);
  return Math.abs(r - rr) / ((r + rr) / 2);
}
