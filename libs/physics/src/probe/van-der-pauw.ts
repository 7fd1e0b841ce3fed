/**
 * Van der Pauw sheet resistance from the two four-terminal resistances of a lamella.
 */
import { brentRoot } from '../numeric/brent';
import { PhysicsInputError } from '../errors';
import { requireObject, requirePositive } from '../validate';
import { THIN_SHEET_FACTOR } from './four-point';

/** Largest R_A/R_B (or R_B/R_A) accepted: beyond it the contacts, not the sheet, dominate. */
export const MAX_RATIO = 1e12;

/** Result of `vanDerPauw`. */
export interface VanDerPauwResult {
  sheetResistanceOhmSq: number;
  /** Present when a thickness was given, ohm cm. */
  resistivityOhmCm?: number;
  /** Van der Pauw's f(R_A / R_B): 1 for equal resistances, about 0.7 at a ratio of 10. */
  correctionFactor: number;
}

/**
 * @internal Solves van der Pauw's f from the ratio r = R_A/R_B:
 * cosh(((r - 1)/(r + 1)) ln2 / f) = exp(ln2 / f) / 2, written in logs as
 * (|c| - 1) ln2 / f + ln(1 + exp(-2 |c| ln2 / f)) = 0, c = (r - 1)/(r + 1), which stays finite for
 * any ratio.
 */
export function vanDerPauwFactor(ratio: number): number {
  const c = Math.abs((ratio - 1) / (ratio + 1));
  if (c < 1e-15) return 1;
  const h = (f: number): number =>
    ((c - 1) * Math.LN2) / f + Math.log1p(Math.exp((-2 * c * Math.LN2) / f));
  const r = brentRoot(h, 1e-9, 1, 1e-15, 300);
  return r.root;
}

/**
 * Sheet resistance of an arbitrarily shaped, uniform, hole-free lamella with four small contacts
 * on its edge.
 *
 * Formula: exp(-pi R_A / R_s) + exp(-pi R_B / R_s) = 1, solved numerically (Brent's method on
 * the form with van der Pauw's factor f):
 *   R_s = (pi / ln 2) ((R_A + R_B) / 2) f(R_A / R_B),  rho = R_s t.
 * Source: L. J. van der Pauw, Philips Res. Rep. 13, 1 (1958).
 *
 * @param input resistanceAOhm, resistanceBOhm (both > 0), optional thicknessCm
 * @example vanDerPauw({ resistanceAOhm: 10, resistanceBOhm: 10 })
 *   // { sheetResistanceOhmSq: 45.324, correctionFactor: 1 }
 */
export function vanDerPauw(input: {
  resistanceAOhm: number;
  resistanceBOhm: number;
  thicknessCm?: number;
}): VanDerPauwResult {
  const fn = 'vanDerPauw';
  const o = requireObject(fn, 'input', input);
  const ra = requirePositive(fn, 'resistanceAOhm', o['resistanceAOhm']);
  const rb = requirePositive(fn, 'resistanceBOhm', o['resistanceBOhm']);
  const ratio = ra / rb;
  if (ratio > MAX_RATIO || ratio < 1 / MAX_RATIO) {
    throw new PhysicsInputError(
      fn,
      'resistanceAOhm and resistanceBOhm',
      `requires resistanceAOhm / resistanceBOhm between 1e-12 and 1e12, got ${ratio}`,
    );
  }
  const f = vanDerPauwFactor(ratio);
  const sheetResistanceOhmSq = THIN_SHEET_FACTOR * ((ra + rb) / 2) * f;
  if (o['thicknessCm'] === undefined) return { sheetResistanceOhmSq, correctionFactor: f };
  const t = requirePositive(fn, 'thicknessCm', o['thicknessCm']);
  return { sheetResistanceOhmSq, resistivityOhmCm: sheetResistanceOhmSq * t, correctionFactor: f };
}
