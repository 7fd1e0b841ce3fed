/**
 * The 23 °C value of a wafer, its uncertainty budget (JCGM 100:2008) and the guard-banded spec
 * verdict (JCGM 106:2012).
 */

/** How the 23 °C value was obtained from a sweep's steps. */
export type ValueAt23CMethod = 'interpolated' | 'corrected';

/** Guard-banded verdict: `indeterminate` when the expanded interval straddles a limit. */
export type SpecVerdict = 'pass' | 'fail' | 'indeterminate';

/** Sources in the uncertainty budget of a 23 °C value. */
export const UNCERTAINTY_SOURCES = [
  'repeatability',
  'temperature-sensor',
  'temperature-correction',
  'probe-spacing',
  'thickness',
] as const;
export type UncertaintySource = (typeof UNCERTAINTY_SOURCES)[number];

/** One line of an uncertainty budget. */
export interface UncertaintyContribution {
  source: UncertaintySource;
  /** Contribution to the combined standard uncertainty (sensitivity x u), ohm cm. */
  standardUncertaintyOhmCm: number;
  /** Contribution / value. */
  relative: number;
  distribution: 'normal' | 'rectangular';
  /** What was assumed, or why the source is not assessed (then the contribution is 0). */
  note: string;
}

/** The uncertainty of a 23 °C value. */
export interface ValueUncertainty {
  /** Expanded uncertainty U = k u_c, ohm cm. */
  uncertaintyOhmCm: number | null;
  /** k, 2. */
  coverageFactor: number | null;
  uncertaintyBudget: UncertaintyContribution[];
}

/** Lot capability from the wafers' 23 °C values (overall spread: Ppk, not Cpk). */
export interface LotCapability {
  /** min(USL - mean, mean - LSL) / (3 s); null with `ppkReason` below 5 wafers. */
  ppk: number | null;
  /** One-sided 95 % lower bound (Bissell 1990). */
  ppkLower95: number | null;
  ppkReason: string | null;
  /** A caution beside Ppk (fewer than 25 wafers), or null. */
  note: string | null;
  indeterminateCount: number;
}

/** Rhotrace's words for each verdict, shared by the web pages and the printed reports. */
export const SPEC_VERDICT_WORDS: Readonly<Record<SpecVerdict, string>> = {
  pass: 'meets spec',
  fail: 'misses spec',
  indeterminate: 'too close to call',
};

/** One sentence on what each verdict means (guard band = expanded uncertainty, k = 2). */
export const SPEC_VERDICT_MEANINGS: Readonly<Record<SpecVerdict, string>> = {
  pass: 'The whole interval value ± U lies inside the spec limits.',
  fail: 'The whole interval value ± U lies outside a spec limit.',
  indeterminate: 'A spec limit lies within value ± U: the measurement cannot decide.',
};
