/**
 * Charge neutrality with incomplete ionization: electron and hole densities, ionized dopants,
 * Fermi level and regime.
 */
import { PHYSICS_DEFAULTS } from '../defaults';
import { logisticComplement } from '../numeric/log-math';
import { requireTemperatureK } from '../validate';
import type { BandModelOptions, DensityOfStatesSet } from './density-of-states';
import { resolveDensityOfStatesSet } from './density-of-states';
import type { DopingLogs, TemperatureTerms } from './neutrality-solve';
import {
  dopingLogs,
  neutralityFunction,
  neutralityRoot,
  temperatureTerms,
} from './neutrality-solve';
import type { Doping, ResolvedDoping } from './dopants';
import { resolveDoping } from './dopants';
import type { SemiconductorId } from './material';
import { requireSemiconductor } from './material';

/** Conduction regime of a sample at one temperature. */
export type Regime = 'freeze-out' | 'extrinsic' | 'intrinsic';

/** @internal Full solver output, in logs where values may underflow. */
export interface NeutralitySolution {
  /** E_F / kT from the valence band edge: the root, reusable as the next solve's start. */
  eta: number;
  lnElectrons: number;
  lnHoles: number;
  lnIntrinsic: number;
  fermiLevelEv: number;
  bandGapEv: number;
  ionizedDonors: number;
  ionizedAcceptors: number;
  /** ln of the majority carrier density over |N_D - N_A| (Infinity when exactly compensated). */
  lnMajorityFraction: number;
  regime: Regime;
  nearDegenerate: boolean;
}

const LN_FREEZE_OUT_THRESHOLD = Math.log(PHYSICS_DEFAULTS.ionizedFractionThreshold);

/**
 * @internal Solves n + N_A^- = p + N_D^+ for the Fermi level, with eta = E_F / kT (E_F from the
 * valence band edge) as the unknown and the equation written as
 * ln(p + N_D^+) - ln(n + N_A^-) = 0, which falls monotonically in eta and never overflows.
 */
export function solveNeutrality(
  material: SemiconductorId,
  set: DensityOfStatesSet,
  doping: ResolvedDoping,
  temperatureK: number,
): NeutralitySolution {
  return solveNeutralityAt(temperatureTerms(material, set, temperatureK), doping);
}

/**
 * @internal `solveNeutrality` on precomputed temperature terms (shared across a curve or a fit),
 * started from `guessEta` (a neighbouring temperature's or parameter set's eta) when given.
 */
export function solveNeutralityAt(
  terms: TemperatureTerms,
  doping: ResolvedDoping,
  guessEta = Number.NaN,
  logs = dopingLogs(doping),
): NeutralitySolution {
  const { kT, epsG, lnNc, lnNv } = terms;
  const g = neutralityFunction(terms, doping, logs);
  const eta = neutralityRoot(g, terms, doping, guessEta).eta;
  const bD = doping.donorDensity === 0 ? 0 : doping.donorBoundFraction;
  const bA = doping.acceptorDensity === 0 ? 0 : doping.acceptorBoundFraction;
  const lnN = g.lnNcMinusG + eta;
  const lnP = lnNv - eta;
  const donorFraction = bD === 0 ? 1 : 1 - bD + bD * logisticComplement(g.donorShift + eta);
  const acceptorFraction = bA === 0 ? 1 : 1 - bA + bA * logisticComplement(g.acceptorShift - eta);
  const lnIntrinsic = 0.5 * (lnNc + lnNv) - 0.5 * epsG;
  const lnMajorityFraction = majorityFraction(doping, logs, lnN, lnP);
  const regime = regimeOf(
    lnIntrinsic,
    Math.abs(doping.donorDensity - doping.acceptorDensity),
    lnMajorityFraction,
    logs.lnNet,
  );
  const margin3 = PHYSICS_DEFAULTS.degeneracyMarginKt;
  return {
    eta,
    lnElectrons: lnN,
    lnHoles: lnP,
    lnIntrinsic,
    fermiLevelEv: eta * kT,
    bandGapEv: terms.bandGapEv,
    ionizedDonors: doping.donorDensity * donorFraction,
    ionizedAcceptors: doping.acceptorDensity * acceptorFraction,
    lnMajorityFraction,
    regime,
    nearDegenerate: eta < margin3 || epsG - eta < margin3,
  };
}

/** ln of the majority carrier density over |N_D - N_A| (Infinity when exactly compensated). */
function majorityFraction(
  doping: ResolvedDoping,
  logs: DopingLogs,
  lnElectrons: number,
  lnHoles: number,
): number {
  if (doping.donorDensity === doping.acceptorDensity) return Number.POSITIVE_INFINITY;
  return (doping.donorDensity > doping.acceptorDensity ? lnElectrons : lnHoles) - logs.lnNet;
}

/**
 * @internal The regime at a solved root, as `solveNeutralityAt` gives it, from the carrier
 * densities' logarithms alone (for callers that need nothing else of the solution).
 */
export function regimeAt(
  terms: TemperatureTerms,
  doping: ResolvedDoping,
  logs: DopingLogs,
  lnElectrons: number,
  lnHoles: number,
): Regime {
  return regimeOf(
    0.5 * (terms.lnNc + terms.lnNv) - 0.5 * terms.epsG,
    Math.abs(doping.donorDensity - doping.acceptorDensity),
    majorityFraction(doping, logs, lnElectrons, lnHoles),
    logs.lnNet,
  );
}

/**
 * @internal The regime rule: `intrinsic` when n_i > |N_D - N_A| (or the sample is exactly
 * compensated); else `freeze-out` when the majority carrier density is below
 * `PHYSICS_DEFAULTS.ionizedFractionThreshold` (90 %) of |N_D - N_A|; else `extrinsic`.
 */
export function regimeOf(
  lnIntrinsic: number,
  net: number,
  lnMajorityFraction: number,
  lnNet = Math.log(net),
): Regime {
  if (net === 0 || lnIntrinsic > lnNet) return 'intrinsic';
  if (lnMajorityFraction < LN_FREEZE_OUT_THRESHOLD) return 'freeze-out';
  return 'extrinsic';
}

/** Result of `carrierDensities`. */
export interface CarrierDensities {
  /** Electron density n, cm^-3. */
  electrons: number;
  /** Hole density p, cm^-3. */
  holes: number;
  /** Ionized donors N_D^+, cm^-3. */
  ionizedDonors: number;
  /** Ionized acceptors N_A^-, cm^-3. */
  ionizedAcceptors: number;
  /** Fermi level above the valence band edge, eV (may lie outside the gap when degenerate). */
  fermiLevelEv: number;
  regime: Regime;
  /** Intrinsic density n_i at this temperature, cm^-3. */
  intrinsicDensity: number;
  /** True when the Fermi level is within 3 kT of a band edge: Boltzmann statistics is doubtful. */
  nearDegenerate: boolean;
}

/**
 * Electron and hole densities from charge neutrality with incomplete ionization.
 *
 * Formula: solve n + N_A^- = p + N_D^+ for E_F with
 *   n = Nc exp(-(Eg - E_F)/kT), p = Nv exp(-E_F/kT),
 *   N_D^+ = N_D / (1 + 2 exp((E_F - Eg + E_d)/kT)), N_A^- = N_A / (1 + 4 exp((E_a - E_F)/kT))
 * (degeneracy 2 for donors, 4 for acceptors), by a safeguarded Newton iteration on
 * ln(p + N_D^+) - ln(n + N_A^-) with its analytic derivative (Brent's method as the fallback).
 * Regime (`regimeOf`): `intrinsic` when n_i > |N_D - N_A|; else `freeze-out` when the majority
 * carrier density is below 90 % of |N_D - N_A| (the ionized fraction of the net doping, so a
 * compensated sample whose donors are mostly ionized can still be frozen out); else `extrinsic`.
 * Ionization at any density (`ionizationModel`, default `pearson-bardeen-1949` for every
 * material): each level falls with density, E(N) = E0 - alpha N^(1/3) (Pearson & Bardeen, Phys.
 * Rev. 75, 865 (1949); silicon alpha = 3e-8 eV cm, from memory, scaled by eps_Si / eps for the
 * other materials) with N = N_D + N_A, clamped at 0: a 45 meV level (P, B in Si) meets the band
 * edge at N_merge = (E0/alpha)^3 = 3.4e18 cm^-3 (the Mott transition). A level at the band edge
 * still holds carriers under Boltzmann statistics, so a share b of the dopants keeps a bound
 * level and the rest count as merged with the band:
 *   N_D^+ = N_D [(1 - b) + b / (1 + 2 exp((E_F - Eg + E_d)/kT))], likewise for acceptors,
 * with b = 1 up to the onset N_merge 10^-D (D = 1.5 for levels of 45 meV or shallower, more
 * decades for deeper ones), 0 from N_merge on and a smooth step between (`boundShare`):
 * ionization becomes complete with no step in doping (rho at 300 K changes by at most 1.31x per
 * 1.2x in doping for the default dopants), and below the onset every carrier freezes out at low
 * temperature (Si:P 1e17 at 10 K: n about 1e9). At 300 K the silicon resistivity tracks ASTM
 * F723 within 9 % from 1e14 to 1e19 (6 % above 1e17). `ionizationModel:
 * 'constant-level'` keeps the tabulated level and merges at `PHYSICS_DEFAULTS.mottDensityCm3`
 * with the same smooth share. Explicit `donorLevel` / `acceptorLevel` values are the isolated
 * levels E0.
 * Assumptions: Boltzmann statistics for the bands (check `nearDegenerate`: within 3 kT of a band
 * edge the densities are overestimated), one donor and one acceptor level, no band-gap narrowing.
 * Source: Sze, Physics of Semiconductor Devices (1981), ch. 1; Blakemore, Semiconductor
 * Statistics (1962).
 *
 * @param material semiconductor id
 * @param doping donor and acceptor densities (cm^-3) and levels (eV)
 * @param temperatureK temperature, K (1 to 1500)
 * @param options optional density-of-states set and ionization model
 * @example carrierDensities('Si', { donorDensity: 1e15, acceptorDensity: 0 }, 300)
 *   // electrons ≈ 1.0e15, holes ≈ 1.0e5, regime 'extrinsic'
 */
export function carrierDensities(
  material: SemiconductorId,
  doping: Doping,
  temperatureK: number,
  options: BandModelOptions = {},
): CarrierDensities {
  const m = requireSemiconductor('carrierDensities', material);
  const d = resolveDoping('carrierDensities', m, doping, options?.ionizationModel);
  const t = requireTemperatureK('carrierDensities', temperatureK);
  const set = resolveDensityOfStatesSet('carrierDensities', m, options?.densityOfStatesSet);
  const s = solveNeutrality(m, set, d, t);
  return {
    electrons: Math.exp(s.lnElectrons),
    holes: Math.exp(s.lnHoles),
    ionizedDonors: s.ionizedDonors,
    ionizedAcceptors: s.ionizedAcceptors,
    fermiLevelEv: s.fermiLevelEv,
    regime: s.regime,
    intrinsicDensity: Math.exp(s.lnIntrinsic),
    nearDegenerate: s.nearDegenerate,
  };
}
