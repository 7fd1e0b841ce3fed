/**
 * The lot's own physics model as a function of temperature, anchored on one measured step, for
 * the 23 °C correction of a sweep with a single step near 23 °C (only the model's ratio
 * rho(296.15 K) / rho(T) is used, not its absolute value).
 */
import {
  DOPANTS,
  METALS,
  metalResistivity,
  resistivity,
  SEMICONDUCTOR_NAMES,
  type AcceptorId,
  type DonorId,
  type Doping,
  type MetalId,
  type SemiconductorId,
} from '@rhotrace/physics';
import type { ModelResistivity } from './value-at-23c';

/** Lot facts the model needs. */
export interface LotModelFacts {
  material: string;
  dopant: string | null;
  dopantType: 'n' | 'p' | null;
}

/** Net doping searched for the anchor, cm^-3 (log bisection between these). */
const DENSITY_RANGE_CM3: readonly [number, number] = [1e12, 1e20];

const guarded =
  (f: (t: number) => number): ModelResistivity =>
  (t) => {
    try {
      const v = f(t);
      return Number.isFinite(v) && v > 0 ? v : null;
    } catch (error) {
      if (error instanceof RangeError) return null;
      throw error;
    }
  };

/**
 * The model resistivity against temperature for the lot: the linear reference of a metal film,
 * or the semiconductor model with the lot's dopant at the net density that reproduces
 * `anchorOhmCm` at `anchorK` (uncompensated). Null when the lot's material, type or dopant is
 * not known to the model, or the anchor lies outside what the density range can give.
 */
export function lotModel(
  lot: LotModelFacts,
  anchorK: number,
  anchorOhmCm: number,
): ModelResistivity | null {
  if (lot.material in METALS) {
    return guarded((t) => metalResistivity(lot.material as MetalId, t));
  }
  if (!(lot.material in SEMICONDUCTOR_NAMES) || lot.dopantType === null) return null;
  const material = lot.material as SemiconductorId;
  const table = DOPANTS[material];
  const species = lot.dopant ?? '';
  const doping = (density: number): Doping =>
    lot.dopantType === 'n'
      ? {
          donorDensity: density,
          acceptorDensity: 0,
          ...(species in table.donors ? { donor: species as DonorId } : {}),
        }
      : {
          donorDensity: 0,
          acceptorDensity: density,
          ...(species in table.acceptors ? { acceptor: species as AcceptorId } : {}),
        };
  const at = (density: number, t: number) => resistivity(material, doping(density), t);
  let lo = Math.log(DENSITY_RANGE_CM3[0]);
  let hi = Math.log(DENSITY_RANGE_CM3[1]);
  try {
    // Resistivity falls as the doping rises: bisect ln(N) until the anchor is matched.
    if (at(Math.exp(lo), anchorK) < anchorOhmCm || at(Math.exp(hi), anchorK) > anchorOhmCm) {
      return null;
    }
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2;
      if (at(Math.exp(mid), anchorK) > anchorOhmCm) lo = mid;
      else hi = mid;
    }
  } catch (error) {
    if (error instanceof RangeError) return null;
    throw error;
  }
  const density = Math.exp((lo + hi) / 2);
  return guarded((t) => at(density, t));
}
