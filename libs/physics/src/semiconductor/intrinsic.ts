/**
 * Intrinsic carrier density from the band gap and the densities of states.
 */
import { BOLTZMANN_EV_PER_K } from '../constants';
import { requireTemperatureK } from '../validate';
import { bandGapUnchecked } from './band-gap';
import type { BandModelOptions, DensityOfStatesSet } from './density-of-states';
import { logDensityOfStates, resolveDensityOfStatesSet } from './density-of-states';
import type { SemiconductorId } from './material';
import { requireSemiconductor } from './material';

/** @internal ln n_i without input checks (finite even where n_i itself underflows). */
export function logIntrinsicDensity(
  set: DensityOfStatesSet,
  material: SemiconductorId,
  temperatureK: number,
): number {
  const { lnNc, lnNv } = logDensityOfStates(set, material, temperatureK);
  const eg = bandGapUnchecked(material, temperatureK);
  return 0.5 * (lnNc + lnNv) - eg / (2 * BOLTZMANN_EV_PER_K * temperatureK);
}

/**
 * Intrinsic carrier density n_i.
 *
 * Formula: n_i = sqrt(Nc Nv) exp(-Eg(T) / (2 k T)), Eg from `bandGap`, Nc and Nv from
 * `densityOfStates`.
 * Assumptions: Boltzmann statistics, undoped material, no band-gap narrowing.
 * Source: Sze, Physics of Semiconductor Devices (1981), eq. for n_i; silicon default checked
 * against Sproul & Green, J. Appl. Phys. 70, 846 (1991) (within 5 % over 250–500 K) and
 * Misiakos & Tsamakis, J. Appl. Phys. 74, 3293 (1993) (within 10 %).
 * Below about 20 K the value underflows towards 0, which is the physical limit (no carriers in
 * an intrinsic semiconductor at 0 K).
 *
 * @param material semiconductor id
 * @param temperatureK temperature, K (1 to 1500)
 * @param options optional density-of-states set
 * @returns n_i, cm^-3
 * @example intrinsicDensity('Si', 300) // 1.0038e10 (cm^-3)
 */
export function intrinsicDensity(
  material: SemiconductorId,
  temperatureK: number,
  options: BandModelOptions = {},
): number {
  const m = requireSemiconductor('intrinsicDensity', material);
  const t = requireTemperatureK('intrinsicDensity', temperatureK);
  const set = resolveDensityOfStatesSet('intrinsicDensity', m, options?.densityOfStatesSet);
  return Math.exp(logIntrinsicDensity(set, m, t));
}
