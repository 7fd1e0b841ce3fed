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
  /** Below this temperature the majority density is under 90 % of the net doping, K. */
  freezeOutBelowK: number | null;
  /** Above this temperature n_i exceeds the net doping |N_D - N_A|, K. */
  intrinsicAboveK: number | null;
}

/** Where the suggested Arrhenius windows end: `null` where the limit is not in 1–1500 K. */
export interface WindowLimits {
  /** Below this temperature the majority density is under half the net doping, K. */
  freezeOutEndK: number | null;
  /** Above this temperature n_i exceeds three times the net doping, K. */
  intrinsicStartK: number | null;
}

const SCAN_POINTS = 64;

/**
 * The freeze-out and intrinsic boundary temperatures of a doped sample.
 *
 * Definitions (the same rule as the regime labels of `carrierDensities`):
 * - `intrinsicAboveK`: the temperature where n_i(T) = |N_D - N_A| (n_i rises monotonically, so
 *   there is at most one); `null` when the sample stays extrinsic up to 1500 K or is
 *   exactly compensated (intrinsic everywhere).
 * - `freezeOutBelowK`: the lowest temperature where the majority carrier density reaches
 *   `PHYSICS_DEFAULTS.ionizedFractionThreshold` (90 %) of |N_D - N_A| on warming; `null` when it
 *   is above 90 % already at 1 K (doping above the merge density) or never reaches it by 1500 K.
 * Method: a 64-point logarithmic scan of 1–1500 K, refined by Brent's method to 1e-6 K.
 *
 * @param material semiconductor id
 * @param doping donor and acceptor densities (cm^-3) and levels (eV)
 * @param options optional density-of-states set and ionization model
 * @example regimeBoundaries('Si', { donorDensity: 1e15, acceptorDensity: 0 })
 *   // { freezeOutBelowK: 87.5, intrinsicAboveK: 547.0 }
 */
export function regimeBoundaries(
  material: SemiconductorId,
  doping: Doping,
  options: BandModelOptions = {},
): RegimeBoundaries {
  return crossings(
    'regimeBoundaries',
    material,
    doping,
    options,
    PHYSICS_DEFAULTS.ionizedFractionThreshold,
    1,
  );
}

/**
 * Limits that keep an Arrhenius window clear of the regime transitions: the freeze-out window
 * should end at `freezeOutEndK`, where the majority carrier density is
 * `PHYSICS_DEFAULTS.freezeOutWindowIonizedFraction` (0.5) of |N_D - N_A|, and the intrinsic
 * window start at `intrinsicStartK`, where n_i = `PHYSICS_DEFAULTS.intrinsicWindowRatio` (3)
 * times |N_D - N_A|. Same method as `regimeBoundaries`.
 *
 * @param material semiconductor id
 * @param doping donor and acceptor densities (cm^-3) and levels (eV)
 * @param options optional density-of-states set and ionization model
 * @example windowLimits('Si', { donorDensity: 1e15, acceptorDensity: 0, donor: 'P' })
 *   // { freezeOutEndK: 62.2, intrinsicStartK: 591.3 }
 */
export function windowLimits(
  material: SemiconductorId,
  doping: Doping,
  options: BandModelOptions = {},
): WindowLimits {
  const c = crossings(
    'windowLimits',
    material,
    doping,
    options,
    PHYSICS_DEFAULTS.freezeOutWindowIonizedFraction,
    PHYSICS_DEFAULTS.intrinsicWindowRatio,
  );
  return { freezeOutEndK: c.freezeOutBelowK, intrinsicStartK: c.intrinsicAboveK };
}

/**
 * The lowest temperature where the majority density reaches `ionizedFraction` of the net doping
 * and the temperature where n_i reaches `intrinsicRatio` times it.
 */
function crossings(
  fn: string,
  material: SemiconductorId,
  doping: Doping,
  options: BandModelOptions,
  ionizedFraction: number,
  intrinsicRatio: number,
): RegimeBoundaries {
  const m = requireSemiconductor(fn, material);
  const d = resolveDoping(fn, m, doping, options?.ionizationModel);
  const set = resolveDensityOfStatesSet(fn, m, options?.densityOfStatesSet);
  const net = Math.abs(d.donorDensity - d.acceptorDensity);
  if (net === 0) return { freezeOutBelowK: null, intrinsicAboveK: null };

  let intrinsicAboveK: number | null = null;
  const lnTarget = Math.log(net * intrinsicRatio);
  const h = (t: number): number => logIntrinsicDensity(set, m, t) - lnTarget;
  if (h(MIN_TEMPERATURE_K) < 0 && h(MAX_TEMPERATURE_K) > 0) {
    const r = brentRoot(h, MIN_TEMPERATURE_K, MAX_TEMPERATURE_K, 1e-6);
    if (r.converged) intrinsicAboveK = r.root;
  }

  // ln(majority / net) - ln(fraction) stays finite where the density itself underflows, and
  // the majority density only rises on warming, so the first sign change is the boundary.
  const lnFraction = Math.log(ionizedFraction);
  const f = (t: number): number => solveNeutrality(m, set, d, t).lnMajorityFraction - lnFraction;
  let freezeOutBelowK: number | null = null;
  const ratio = Math.pow(MAX_TEMPERATURE_K / MIN_TEMPERATURE_K, 1 / (SCAN_POINTS - 1));
  let previous = MIN_TEMPERATURE_K;
  if (f(previous) < 0) {
    for (let i = 1; i < SCAN_POINTS; i++) {
      const t = i === SCAN_POINTS - 1 ? MAX_TEMPERATURE_K : MIN_TEMPERATURE_K * Math.pow(ratio, i);
      if (f(t) >= 0) {
        const r = brentRoot(f, previous, t, 1e-6);
        if (r.converged) freezeOutBelowK = r.root;
        break;
      }
      previous = t;
    }
  }
  return { freezeOutBelowK, intrinsicAboveK };
}
