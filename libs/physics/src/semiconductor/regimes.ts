/**
 * Temperatures that separate the freeze-out, extrinsic and intrinsic regimes.
 */
import { MAX_TEMPERATURE_K, MIN_TEMPERATURE_K } from '../constants';
import { PHYSICS_DEFAULTS } from '../defaults';
import { brentRoot } from '../numeric/brent';
import type { BandModelOptions } from './density-of-states';
import { resolveDensityOfStatesSet } from './density-of-states';
import type { Doping } from './dopants';
import { resolveDoping } from './dopants';
import { logIntrinsicDensity } from './intrinsic';
import type { SemiconductorId } from './material';
import { requireSemiconductor } from './material';
import { solveNeutrality } from './neutrality';

/** Regime boundaries; `null` where the boundary does not exist between 1 K and 1500 K. */
export interface RegimeBoundaries {
  /** Below this temperature less than 90 % of the majority dopant is ionized, K. */
  freezeOutBelowK: number | null;
  /** Above this temperature n_i exceeds the net doping |N_D - N_A|, K. */
  intrinsicAboveK: number | null;
}

const SCAN_POINTS = 64;

/**
 * The freeze-out and intrinsic boundary temperatures of a doped sample.
 *
 * Definitions (the same as the regime labels of `carrierDensities`):
 * - `intrinsicAboveK`: the temperature where n_i(T) = |N_D - N_A| (n_i rises monotonically, so
 *   there is at most one); `null` when the sample stays extrinsic up to 1500 K or is
 *   exactly compensated (intrinsic everywhere).
 * - `freezeOutBelowK`: the lowest temperature where the ionized fraction of the majority dopant
 *   reaches `PHYSICS_DEFAULTS.ionizedFractionThreshold` (90 %) on warming; `null` when it is
 *   above 90 % already at 1 K (Mott-density doping, heavy compensation) or never reaches it by
 *   1500 K.
 * Method: a 64-point logarithmic scan of 1–1500 K, refined by Brent's method to 1e-6 K.
 *
 * @param material semiconductor id
 * @param doping donor and acceptor densities (cm^-3) and levels (eV)
 * @param options optional density-of-states set
 * @example regimeBoundaries('Si', { donorDensity: 1e15, acceptorDensity: 0 })
 *   // { freezeOutBelowK: 87.5, intrinsicAboveK: 547.0 }
 */
export function regimeBoundaries(
  material: SemiconductorId,
  doping: Doping,
  options: BandModelOptions = {},
): RegimeBoundaries {
  const m = requireSemiconductor('regimeBoundaries', material);
  const d = resolveDoping('regimeBoundaries', m, doping, options?.ionizationModel);
  const set = resolveDensityOfStatesSet('regimeBoundaries', m, options?.densityOfStatesSet);
  const net = Math.abs(d.donorDensity - d.acceptorDensity);

  let intrinsicAboveK: number | null = null;
  if (net > 0) {
    const lnNet = Math.log(net);
    const h = (t: number): number => logIntrinsicDensity(set, m, t) - lnNet;
    if (h(MIN_TEMPERATURE_K) < 0 && h(MAX_TEMPERATURE_K) > 0) {
      const r = brentRoot(h, MIN_TEMPERATURE_K, MAX_TEMPERATURE_K, 1e-6);
      if (r.converged) intrinsicAboveK = r.root;
    }
  }

  let freezeOutBelowK: number | null = null;
  if (d.donorDensity > 0 || d.acceptorDensity > 0) {
    const threshold = PHYSICS_DEFAULTS.ionizedFractionThreshold;
    const f = (t: number): number =>
      solveNeutrality(m, set, d, t).majorityIonizedFraction - threshold;
    const ratio = Math.pow(MAX_TEMPERATURE_K / MIN_TEMPERATURE_K, 1 / (SCAN_POINTS - 1));
    // The low-temperature crossing is the boundary: far above it the fraction can dip again
    // (kT comparable to the level), but there n_i dominates and the regime is intrinsic.
    let previous = MIN_TEMPERATURE_K;
    if (f(previous) < 0) {
      for (let i = 1; i < SCAN_POINTS; i++) {
        const t =
          i === SCAN_POINTS - 1 ? MAX_TEMPERATURE_K : MIN_TEMPERATURE_K * Math.pow(ratio, i);
        if (f(t) >= 0) {
          const r = brentRoot(f, previous, t, 1e-6);
          if (r.converged) freezeOutBelowK = r.root;
          break;
        }
        previous = t;
      }
    }
  }
  return { freezeOutBelowK, intrinsicAboveK };
}
