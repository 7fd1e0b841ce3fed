/**
 * Dual-configuration four-point probe: sheet resistance from the two configurations of one
 * collinear probe, which corrects for the edge and for spacing errors without knowing where
 * the edge is.
 */
import { PhysicsInputError } from '../errors';
import { requireObject, requirePositive } from '../validate';

/** R_a / R_b of an ideal probe on an infinite thin sheet: 2 ln 2 / ln 3 = 1.2619. */
export const DUAL_CONFIGURATION_IDEAL_RATIO = (2 * Math.LN2) / Math.log(3);

/**
 * Ratios R_a / R_b the relation is used for. Near an edge the ratio falls below the ideal
 * 1.2619; readings with a ratio far outside this band come from a probe off the sample or a
 * faulty contact, not from geometry, and the quadratic no longer describes them. The band is
 * Rhotrace's choice (common practice, no source): below 1.0 the quadratic has fallen to 2.6,
 * above 1.32 the ratio exceeds the ideal by more than a reading's noise explains.
 */
export const DUAL_CONFIGURATION_RATIO_RANGE = { min: 1.0, max: 1.32 } as const;

/** Result of `dualConfiguration`. */
export interface DualConfigurationResult {
  sheetResistanceOhmSq: number;
  /** R_a / R_b as measured. */
  ratio: number;
  /** R_s / R_a, the geometric factor the ratio gives (4.535 at the ideal ratio). */
  factor: number;
}

/**
 * Sheet resistance from a dual-configuration four-point measurement.
 *
 * Configuration a: current through the outer probes 1-4, voltage across 2-3 (R_a = V23 / I14);
 * configuration b: current through 1-3, voltage across 2-4 (R_b = V24 / I13). On an infinite
 * thin sheet R_a = R_s ln 2 / pi and R_b = R_s ln 3 / (2 pi), so R_a / R_b = 1.2619.
 * Formula (Rymaszewski's relation in its fitted form, as SEMI MF1529 gives it):
 *   R_s = (-14.696 + 25.173 (R_a / R_b) - 7.872 (R_a / R_b)^2) R_a
 * which gives R_s / R_a = 4.535 at the ideal ratio (the exact pi / ln 2 = 4.532).
 * Assumptions: a thin sheet (thickness well below the spacing), one probe head used in both
 * configurations, forward and reverse currents already averaged.
 * Source: R. Rymaszewski, J. Phys. E 2, 170 (1969); SEMI MF1529 (dual-configuration
 * four-point probe sheet resistance). The coefficients are quoted without a copy of the
 * standard at hand; they reproduce the standard's stated 4.535 at the ideal ratio.
 *
 * @param input resistanceAOhm (R_a, > 0), resistanceBOhm (R_b, > 0), both V / I in ohm
 * @example dualConfiguration({ resistanceAOhm: 1, resistanceBOhm: 1 / 1.2619 })
 *   // { sheetResistanceOhmSq: 4.5345, ratio: 1.2619, factor: 4.5345 }
 */
export function dualConfiguration(input: {
  resistanceAOhm: number;
  resistanceBOhm: number;
}): DualConfigurationResult {
  const fn = 'dualConfiguration';
  const o = requireObject(fn, 'input', input);
  const ra = requirePositive(fn, 'resistanceAOhm', o['resistanceAOhm']);
  const rb = requirePositive(fn, 'resistanceBOhm', o['resistanceBOhm']);
  const ratio = ra / rb;
  const { min, max } = DUAL_CONFIGURATION_RATIO_RANGE;
  if (!(ratio >= min && ratio <= max)) {
    throw new PhysicsInputError(
      fn,
      'resistanceAOhm and resistanceBOhm',
      `requires R_a / R_b between ${min} and ${max} (ideal ${DUAL_CONFIGURATION_IDEAL_RATIO.toFixed(4)}), got ${ratio.toPrecision(5)}`,
    );
  }
  const factor = -14.696 + 25.173 * ratio - 7.872 * ratio * ratio;
  return { sheetResistanceOhmSq: factor * ra, ratio, factor };
}
