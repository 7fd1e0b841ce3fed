/**
 * The doping of an uncompensated sample from one resistivity reading: the model inverted.
 */
import { MAX_DOPING_CM3 } from './dopants';
import type { AcceptorId, DonorId, Doping } from './dopants';
import { brentRoot } from '../numeric/brent';
import { requireOneOf, requirePositive, requireTemperatureK } from '../validate';
import type { SemiconductorId } from './material';
import { requireSemiconductor } from './material';
import type { ResistivityOptions } from './resistivity';
import { resistivity } from './resistivity';

/** Lowest density the inversion searches, cm^-3. */
const MIN_SEARCH_CM3 = 1e8;

/**
 * The donor (n-type) or acceptor (p-type) density whose model resistivity at `temperatureK`
 * equals the reading, with the other dopant absent: the inverse of `resistivity` in doping,
 * which is monotonic (falls with doping in every material from 1e14 to 1e20 cm^-3).
 * Method: Brent's method on ln rho(N) - ln rho_measured over ln N from 1e8 to 1e22 cm^-3.
 * Returns null when the reading lies outside what the model gives over that range (above the
 * intrinsic resistivity, or below that of 1e22 cm^-3). An uncompensated sample is assumed: a
 * compensated one has a lower net doping than the result.
 *
 * @param material semiconductor id
 * @param type 'n' or 'p'
 * @param resistivityOhmCm the reading, ohm cm (> 0)
 * @param temperatureK its temperature, K; best inside the extrinsic range
 * @param species optional `donor` / `acceptor` species (default per material)
 * @param options model options, as for `resistivity`
 * @example dopingFromResistivity('Si', 'n', 4.72, 300) // { donorDensity: 1.0e15, ... }
 */
export function dopingFromResistivity(
  material: SemiconductorId,
  type: 'n' | 'p',
  resistivityOhmCm: number,
  temperatureK: number,
  species: { donor?: DonorId; acceptor?: AcceptorId } = {},
  options: ResistivityOptions = {},
): Doping | null {
  const fn = 'dopingFromResistivity';
  const m = requireSemiconductor(fn, material);
  const kind = requireOneOf(fn, 'type', type, ['n', 'p'] as const);
  const rho = requirePositive(fn, 'resistivityOhmCm', resistivityOhmCm);
  const t = requireTemperatureK(fn, temperatureK);
  const make = (n: number): Doping =>
    kind === 'n'
      ? { ...species, donorDensity: n, acceptorDensity: 0 }
      : { ...species, donorDensity: 0, acceptorDensity: n };
  const lnRho = Math.log(rho);
  const g = (lnN: number) => Math.log(resistivity(m, make(Math.exp(lnN)), t, options)) - lnRho;
  const lo = Math.log(MIN_SEARCH_CM3);
  // exp(ln 1e22) rounds just above 1e22, which `resistivity` refuses.
  const hi = Math.log(MAX_DOPING_CM3 * (1 - 1e-12));
  if (g(lo) < 0 || g(hi) > 0) return null;
  const r = brentRoot(g, lo, hi, 1e-9);
  return r.converged ? make(Math.exp(r.root)) : null;
}
