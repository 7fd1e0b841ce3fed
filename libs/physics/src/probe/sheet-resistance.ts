/**
 * A uniform layer given by its sheet resistance.
 */
import { requireObject, requirePositive } from '../validate';

/**
 * Resistivity of a uniform layer from its sheet resistance and thickness.
 *
 * Formula: rho = R_s * t (definition of sheet resistance, R_s = rho / t).
 * Assumptions: the layer is homogeneous through its thickness.
 * Source: common practice (definition of sheet resistance).
 *
 * @param input sheetResistanceOhmSq (ohm per square, > 0), thicknessCm (> 0)
 * @returns resistivity, ohm cm
 * @example resistivityFromSheetResistance({ sheetResistanceOhmSq: 45.3, thicknessCm: 0.05 })
 *   // 2.265 (ohm cm)
 */
export function resistivityFromSheetResistance(input: {
  sheetResistanceOhmSq: number;
  thicknessCm: number;
}): number {
  const fn = 'resistivityFromSheetResistance';
  const o = requireObject(fn, 'input', input);
  const rs = requirePositive(fn, 'sheetResistanceOhmSq', o['sheetResistanceOhmSq']);
  const t = requirePositive(fn, 'thicknessCm', o['thicknessCm']);
  return rs * t;
}
