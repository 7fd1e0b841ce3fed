/**
 * Uncertainty budgets in the manner of the GUM (JCGM 100:2008, Evaluation of measurement data -
 * Guide to the expression of uncertainty in measurement).
 */
import { requireArray, requireFiniteNumber, requireNonNegative } from '../validate';

/**
 * Coverage factor for expanded uncertainties, U = k u_c. k = 2 gives a coverage probability of
 * about 95 % for a normal distribution (JCGM 100:2008, 6.2.1 and 6.3.3).
 */
export const COVERAGE_FACTOR = 2;

/**
 * Standard uncertainty of a quantity known only to lie within +/- `halfWidth` of its value,
 * with every value in the range equally likely (a rectangular distribution).
 *
 * Formula: u = a / sqrt(3) (JCGM 100:2008, 4.3.7).
 *
 * @param halfWidth a, the half-width of the interval, in the quantity's own unit (>= 0)
 * @returns the standard uncertainty, same unit
 * @example rectangularStandardUncertainty(0.415) // 0.23960
 */
export function rectangularStandardUncertainty(halfWidth: number): number {
  return (
    requireNonNegative('rectangularStandardUncertainty', 'halfWidth', halfWidth) / Math.sqrt(3)
  );
}

/**
 * Combined standard uncertainty of uncorrelated input quantities: the root sum of squares of the
 * contributions, each already multiplied by its sensitivity coefficient (c_i u(x_i)).
 *
 * Formula: u_c = sqrt(sum_i (c_i u(x_i))^2) (JCGM 100:2008, equation 10, 5.1.2).
 * Assumes the inputs are uncorrelated; signs of the contributions do not matter.
 *
 * @param contributions c_i u(x_i), in the output quantity's unit (finite numbers)
 * @returns u_c, same unit; 0 for an empty list
 * @example combinedStandardUncertainty([3, 4]) // 5
 */
export function combinedStandardUncertainty(contributions: readonly number[]): number {
  const list = requireArray('combinedStandardUncertainty', 'contributions', contributions);
  let sum = 0;
  list.forEach((c, i) => {
    const v = requireFiniteNumber('combinedStandardUncertainty', `contributions[${i}]`, c);
    sum += v * v;
  });
  return Math.sqrt(sum);
}

/** Tolerance classes of IEC 60751 for platinum resistance thermometers. */
export type Iec60751Class = 'AA' | 'A' | 'B' | 'C';

/** Tolerance of each IEC 60751 class: +/- (offsetC + slope |t|) in °C, t in °C. */
export const IEC_60751_TOLERANCE: Readonly<
  Record<Iec60751Class, { offsetC: number; slope: number }>
> = {
  AA: { offsetC: 0.1, slope: 0.0017 },
  A: { offsetC: 0.15, slope: 0.002 },
  B: { offsetC: 0.3, slope: 0.005 },
  C: { offsetC: 0.6, slope: 0.01 },
};

/**
 * Tolerance (half-width of the permitted deviation) of a platinum resistance thermometer of an
 * IEC 60751 class at a temperature.
 *
 * Formula: class B, +/- (0.3 + 0.005 |t|) °C; class A, +/- (0.15 + 0.002 |t|) °C
 * (IEC 60751:2008, table 1). A kelvin difference equals a °C difference.
 * The classes are defined over limited ranges (class B -196 to 600 °C); this function does not
 * check the range.
 *
 * @param temperatureC t, °C
 * @param toleranceClass the class, default 'B'
 * @returns the tolerance, K
 * @example iec60751Tolerance(23) // 0.415
 */
export function iec60751Tolerance(
  temperatureC: number,
  toleranceClass: Iec60751Class = 'B',
): number {
  const t = requireFiniteNumber('iec60751Tolerance', 'temperatureC', temperatureC);
  const c = IEC_60751_TOLERANCE[toleranceClass];
  if (!c) {
    throw new RangeError(
      `\`iec60751Tolerance\` requires toleranceClass AA, A, B or C, got ${String(toleranceClass)}`,
    );
  }
  return c.offsetC + c.slope * Math.abs(t);
}
