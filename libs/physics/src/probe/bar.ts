/**
 * Bar (bridge) sample with a uniform cross-section.
 */
import { requireObject, requirePositive } from '../validate';
import { voltageOverCurrent } from './four-point';

/**
 * Resistivity of a bar measured between two voltage taps a length L apart.
 *
 * Formula: rho = (V / I) * w * t / L (Ohm's law for a uniform prism).
 * Assumptions: uniform current density between the taps (taps far from the current contacts).
 * Source: common practice (definition of resistivity).
 *
 * @param input voltageV, currentA (non-zero), lengthCm (tap spacing), widthCm, thicknessCm
 * @returns resistivity, ohm cm
 * @example barResistivity({ voltageV: 0.5, currentA: 0.001, lengthCm: 1, widthCm: 0.2, thicknessCm: 0.05 })
 *   // 5 (ohm cm)
 */
export function barResistivity(input: {
  voltageV: number;
  currentA: number;
  lengthCm: number;
  widthCm: number;
  thicknessCm: number;
}): number {
  const fn = 'barResistivity';
  const o = requireObject(fn, 'input', input);
  const ratio = voltageOverCurrent(fn, o);
  const l = requirePositive(fn, 'lengthCm', o['lengthCm']);
  const w = requirePositive(fn, 'widthCm', o['widthCm']);
  const t = requirePositive(fn, 'thicknessCm', o['thicknessCm']);
  return (ratio * w * t) / l;
}
