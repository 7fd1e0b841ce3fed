/**
 * Band gap against temperature, Varshni form.
 */
import type { Citation, SemiconductorId } from './material';
import { requireSemiconductor } from './material';
import { requireTemperatureK } from '../validate';

/** Varshni parameters Eg(T) = Eg0 - alpha T^2 / (T + beta). */
export interface VarshniParameters {
  /** Gap at 0 K, eV. */
  eg0Ev: number;
  /** alpha, eV/K. */
  alphaEvPerK: number;
  /** beta, K. */
  betaK: number;
  /** Temperature range the set was fitted over, K (outside it the formula extrapolates). */
  fittedRangeK: [number, number];
  source: Citation;
}

/**
 * Varshni parameter sets per material. Si, Ge, GaAs: Thurmond 1975. 4H-SiC: the set common in
 * device simulators, with Eg0 chosen so that Eg(300 K) = 3.26 eV.
 */
export const VARSHNI_PARAMETERS: Readonly<Record<SemiconductorId, VarshniParameters>> = {
  Si: {
    eg0Ev: 1.17,
    alphaEvPerK: 4.73e-4,
    betaK: 636,
    fittedRangeK: [0, 1200],
    source: { label: 'Thurmond 1975', reference: 'J. Electrochem. Soc. 122, 1133 (1975)' },
  },
  Ge: {
    eg0Ev: 0.7437,
    alphaEvPerK: 4.774e-4,
    betaK: 235,
    fittedRangeK: [0, 1000],
    source: {
      label: 'Thurmond 1975',
      reference: 'J. Electrochem. Soc. 122, 1133 (1975); Eg0 from memory',
      fromMemory: true,
    },
  },
  GaAs: {
    eg0Ev: 1.519,
    alphaEvPerK: 5.405e-4,
    betaK: 204,
    fittedRangeK: [0, 1000],
    source: {
      label: 'Thurmond 1975',
      reference: 'J. Electrochem. Soc. 122, 1133 (1975); Sze, Physics of Semiconductor Devices',
      fromMemory: true,
    },
  },
  '4H-SiC': {
    // Eg0 = 3.26 + alpha * 300^2 / (300 + beta), so that Eg(300 K) = 3.26 eV exactly.
    eg0Ev: 3.26 + (8.2e-4 * 300 * 300) / (300 + 1800),
    alphaEvPerK: 8.2e-4,
    betaK: 1800,
    fittedRangeK: [0, 700],
    source: {
      label: 'device-simulator set',
      reference: 'Eg(300 K) = 3.26 eV, alpha 8.2e-4 eV/K, beta 1800 K',
      fromMemory: true,
    },
  },
};

/** @internal Varshni gap without input checks. */
export function bandGapUnchecked(material: SemiconductorId, temperatureK: number): number {
  const p = VARSHNI_PARAMETERS[material];
  return p.eg0Ev - (p.alphaEvPerK * temperatureK * temperatureK) / (temperatureK + p.betaK);
}

/**
 * Band gap of a semiconductor at a temperature (Varshni 1967 form, Thurmond 1975 parameters).
 *
 * Formula: Eg(T) = Eg0 - alpha * T^2 / (T + beta), parameters in {@link VARSHNI_PARAMETERS}.
 * Assumptions: undoped material (no band-gap narrowing from heavy doping); outside a set's
 * fitted range the formula extrapolates.
 * Source: Y. P. Varshni, Physica 34, 149 (1967); C. D. Thurmond, J. Electrochem. Soc. 122, 1133
 * (1975).
 *
 * @param material semiconductor id
 * @param temperatureK temperature, K (1 to 1500)
 * @returns band gap, eV
 * @example bandGap('Si', 300) // 1.1245 (eV)
 */
export function bandGap(material: SemiconductorId, temperatureK: number): number {
  const m = requireSemiconductor('bandGap', material);
  const t = requireTemperatureK('bandGap', temperatureK);
  return bandGapUnchecked(m, t);
}
