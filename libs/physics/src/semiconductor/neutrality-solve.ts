/**
 * The charge-neutrality root: the Fermi level at one temperature, by a safeguarded Newton
 * iteration on the analytic derivative with Brent's method as the fallback.
 */
import { BOLTZMANN_EV_PER_K } from '../constants';
import { PHYSICS_DEFAULTS } from '../defaults';
import { brentRoot } from '../numeric/brent';
import {
  logAddExp,
  logAddExpWithShares,
  logisticComplement,
  softplus,
  softplusWithLogistic,
} from '../numeric/log-math';
import { bandGapUnchecked } from './band-gap';
import type { DensityOfStatesSet } from './density-of-states';
import { logDensityOfStates } from './density-of-states';
import type { ResolvedDoping } from './dopants';
import type { SemiconductorId } from './material';

/** @internal The terms of the neutrality equation that depend on temperature only. */
export interface TemperatureTerms {
  temperatureK: number;
  kT: number;
  bandGapEv: number;
  /** Eg / kT. */
  epsG: number;
  lnNc: number;
  lnNv: number;
}

/** @internal Computes the temperature-only terms once, to be shared by every doping. */
export function temperatureTerms(
  material: SemiconductorId,
  set: DensityOfStatesSet,
  temperatureK: number,
): TemperatureTerms {
  const kT = BOLTZMANN_EV_PER_K * temperatureK;
  const bandGapEv = bandGapUnchecked(material, temperatureK);
  const { lnNc, lnNv } = logDensityOfStates(set, material, temperatureK);
  return { temperatureK, kT, bandGapEv, epsG: bandGapEv / kT, lnNc, lnNv };
}

const LN_GD = Math.log(PHYSICS_DEFAULTS.donorDegeneracy);
const LN_GA = Math.log(PHYSICS_DEFAULTS.acceptorDegeneracy);
/** The bracket spans the gap plus a margin wide enough for 1e22 cm^-3 against Nc or Nv at 1 K. */
const BRACKET_MARGIN = 80;
const NEWTON_MAX_STEPS = 60;
const NEWTON_STEP_TOLERANCE = 1e-8;
/** The logistic `softplusWithLogistic` returns beside softplus (the solve is synchronous). */
const scratch = { logistic: 0 };
/** The shares `logAddExpWithShares` returns beside a log-sum. */
const shares = { first: 0, second: 0 };

/** @internal The logarithms of a doping that every temperature's solve shares. */
export interface DopingLogs {
  lnNd: number;
  lnNa: number;
  /** ln of the merged (always ionized) shares 1 - b and of the bound shares b. */
  lnFreeD: number;
  lnFreeA: number;
  lnBD: number;
  lnBA: number;
  /** No bound share (b = 0): the species is fully ionized. */
  donorsFull: boolean;
  acceptorsFull: boolean;
  /** ln(N_D + N_A) and ln|N_D - N_A| (-Infinity when 0). */
  lnTotal: number;
  lnNet: number;
}

/** @internal Takes a doping's logarithms once, for a curve or a fit's parameter set. */
export function dopingLogs(doping: ResolvedDoping): DopingLogs {
  const { donorDensity, acceptorDensity } = doping;
  // N_D^+ = N_D [(1 - b) + b / (1 + e^s)]: a share 1 - b has merged with the band (ionized).
  const bD = donorDensity === 0 ? 0 : doping.donorBoundFraction;
  const bA = acceptorDensity === 0 ? 0 : doping.acceptorBoundFraction;
  return {
    lnNd: donorDensity > 0 ? Math.log(donorDensity) : Number.NEGATIVE_INFINITY,
    lnNa: acceptorDensity > 0 ? Math.log(acceptorDensity) : Number.NEGATIVE_INFINITY,
    lnFreeD: bD >= 1 ? Number.NEGATIVE_INFINITY : Math.log1p(-bD),
    lnFreeA: bA >= 1 ? Number.NEGATIVE_INFINITY : Math.log1p(-bA),
    lnBD: bD === 0 ? 0 : Math.log(bD),
    lnBA: bA === 0 ? 0 : Math.log(bA),
    donorsFull: bD === 0,
    acceptorsFull: bA === 0,
    lnTotal: Math.log(donorDensity + acceptorDensity),
    lnNet: Math.log(Math.abs(donorDensity - acceptorDensity)),
  };
}

/**
 * @internal The neutrality function g(eta) = ln(p + N_D^+) - ln(n + N_A^-), eta = E_F / kT
 * from the valence band edge, with its derivative; g falls monotonically in eta. A class, not
 * closures: a curve builds one per temperature, and methods cost nothing to create.
 */
export class NeutralityFunction {
  /** Shifts of the donor and acceptor occupancy exponents (ln g + level terms). */
  readonly donorShift: number;
  readonly acceptorShift: number;
  readonly lnNcMinusG: number;
  private readonly lnNv: number;
  private readonly lnNd: number;
  private readonly lnNa: number;
  private readonly donorsFull: boolean;
  private readonly acceptorsFull: boolean;
  private readonly lnFreeD: number;
  private readonly lnFreeA: number;
  private readonly lnBD: number;
  private readonly lnBA: number;
  private readonly kT: number;

  constructor(terms: TemperatureTerms, doping: ResolvedDoping, logs = dopingLogs(doping)) {
    const { kT, epsG, lnNc, lnNv } = terms;
    this.kT = kT;
    this.lnNv = lnNv;
    this.lnNd = logs.lnNd;
    this.lnNa = logs.lnNa;
    // Donor term exponent: ln gD + (E_F - (E_c - E_d)) / kT = ln gD + eta - epsG + epsD.
    this.donorShift = LN_GD - epsG + doping.donorLevelEv / kT;
    this.acceptorShift = LN_GA + doping.acceptorLevelEv / kT;
    this.donorsFull = logs.donorsFull;
    this.acceptorsFull = logs.acceptorsFull;
    this.lnFreeD = logs.lnFreeD;
    this.lnFreeA = logs.lnFreeA;
    this.lnBD = logs.lnBD;
    this.lnBA = logs.lnBA;
    this.lnNcMinusG = lnNc - epsG;
  }

  /** g(eta). */
  value(eta: number): number {
    const lnP = this.lnNv - eta;
    const lnN = this.lnNcMinusG + eta;
    const lnDp = this.donorsFull
      ? this.lnNd
      : this.lnNd + logAddExp(this.lnFreeD, this.lnBD - softplus(this.donorShift + eta));
    const lnAm = this.acceptorsFull
      ? this.lnNa
      : this.lnNa + logAddExp(this.lnFreeA, this.lnBA - softplus(this.acceptorShift - eta));
    return logAddExp(lnP, lnDp) - logAddExp(lnN, lnAm);
  }

  /**
   * g and dg/deta at eta; the slope is written to `out`. d ln F / d eta of
   * F = (1 - b) + b / (1 + e^s) is -b e^-softplus(s) logistic(s) / F, with ds/deta = +1 for the
   * donors and -1 for the acceptors; the same expressions as `value`.
   */
  valueAndSlope(eta: number, out: { slope: number }): number {
    const lnP = this.lnNv - eta;
    const lnN = this.lnNcMinusG + eta;
    let lnDp = this.lnNd;
    let dLnDp = 0;
    // With no merged share (ln(1 - b) = -Infinity) ln F is the bound term itself and
    // e^(bound - ln F) is exactly 1: the exponential is skipped, the result is the same.
    if (!this.donorsFull) {
      const bound = this.lnBD - softplusWithLogistic(this.donorShift + eta, scratch);
      const lnF = logAddExp(this.lnFreeD, bound);
      lnDp = this.lnNd + lnF;
      dLnDp = -(lnF === bound ? 1 : Math.exp(bound - lnF)) * scratch.logistic;
    }
    let lnAm = this.lnNa;
    let dLnAm = 0;
    if (!this.acceptorsFull) {
      const bound = this.lnBA - softplusWithLogistic(this.acceptorShift - eta, scratch);
      const lnF = logAddExp(this.lnFreeA, bound);
      lnAm = this.lnNa + lnF;
      dLnAm = (lnF === bound ? 1 : Math.exp(bound - lnF)) * scratch.logistic;
    }
    // The shares of each sum come from the exponential its logarithm takes (no further exp).
    const u = logAddExpWithShares(lnP, lnDp, shares);
    const du = -shares.first + (dLnDp === 0 ? 0 : shares.second * dLnDp);
    const v = logAddExpWithShares(lnN, lnAm, shares);
    const dv = shares.first + (dLnAm === 0 ? 0 : shares.second * dLnAm);
    out.slope = du - dv;
    return u - v;
  }

  /**
   * The partial derivatives of g at eta (for the implicit-function derivative of the root,
   * d eta / dx = -(dg/dx) / (dg/d eta)). With F_D = (1 - b_D) + b_D / (1 + e^s) and
   * U = ln(p + N_D F_D): dU/dN_D = F_D / (p + N_D^+), dU/db_D = -(N_D^+ / (p + N_D^+))
   * logistic(s) / F_D, dU/dE_d = (N_D^+ / (p + N_D^+)) (d ln F_D / ds) / kT; the acceptor
   * terms likewise with the opposite sign (g = U - V) and s = ln g_A + (E_a - E_F) / kT.
   */
  partials(eta: number, out: NeutralityPartials): void {
    const lnP = this.lnNv - eta;
    const lnN = this.lnNcMinusG + eta;
    // The donor side: ln F_D, d ln F_D / ds and logistic(s) at s = donorShift + eta.
    const sD = this.donorShift + eta;
    const logisticD = logisticComplement(-sD);
    const boundD = this.lnBD - softplus(sD);
    const lnFD = this.donorsFull ? 0 : logAddExp(this.lnFreeD, boundD);
    const dLnFD = this.donorsFull ? 0 : -Math.exp(boundD - lnFD) * logisticD;
    const lnDp = this.lnNd + lnFD;
    const sA = this.acceptorShift - eta;
    const logisticA = logisticComplement(-sA);
    const boundA = this.lnBA - softplus(sA);
    const lnFA = this.acceptorsFull ? 0 : logAddExp(this.lnFreeA, boundA);
    const dLnFA = this.acceptorsFull ? 0 : -Math.exp(boundA - lnFA) * logisticA;
    const lnAm = this.lnNa + lnFA;
    const u = logAddExp(lnP, lnDp);
    const v = logAddExp(lnN, lnAm);
    const shareD = Math.exp(lnDp - u);
    const shareA = Math.exp(lnAm - v);
    out.eta = -Math.exp(lnP - u) + shareD * dLnFD - Math.exp(lnN - v) + shareA * dLnFA;
    out.donorDensity = Math.exp(lnFD - u);
    out.acceptorDensity = -Math.exp(lnFA - v);
    out.donorLevelEv = (shareD * dLnFD) / this.kT;
    out.acceptorLevelEv = (-shareA * dLnFA) / this.kT;
    out.donorBoundFraction = -shareD * logisticD * Math.exp(-lnFD);
    out.acceptorBoundFraction = shareA * logisticA * Math.exp(-lnFA);
  }
}

/** @internal Partial derivatives of the neutrality function g (see `NeutralityFunction`). */
export interface NeutralityPartials {
  eta: number;
  /** Per cm^-3. */
  donorDensity: number;
  acceptorDensity: number;
  /** Per eV. */
  donorLevelEv: number;
  acceptorLevelEv: number;
  donorBoundFraction: number;
  acceptorBoundFraction: number;
}

/** @internal Builds g(eta) and g'(eta) for one doping at one temperature. */
export function neutralityFunction(
  terms: TemperatureTerms,
  doping: ResolvedDoping,
  logs = dopingLogs(doping),
): NeutralityFunction {
  return new NeutralityFunction(terms, doping, logs);
}

/** @internal The root eta and how it was found. */
export interface NeutralityRoot {
  eta: number;
  /** Newton iterations taken (0 when Brent's method gave the root). */
  newtonSteps: number;
  converged: boolean;
}

/**
 * @internal Solves g(eta) = 0 inside [-80, Eg/kT + 80] from a starting point (a neighbour's
 * root, else an estimate from the net doping): Newton steps eta - g/g' on the analytic
 * derivative, each checked against the bracket that the signs of g seen so far leave (a step
 * outside it is replaced by bisection), stopping after a Newton step below 1e-8 (the error left
 * is then of order 1e-16); g is monotone, so the bracket always holds the root. Should the iteration not
 * settle within 60 steps, Brent's method on the whole bracket (tolerance 1e-10) gives the root as
 * before. Source: Press et al., Numerical Recipes, 3rd ed. (2007), section 9.4 (rtsafe).
 */
export function neutralityRoot(
  g: NeutralityFunction,
  terms: TemperatureTerms,
  doping: ResolvedDoping,
  guessEta = Number.NaN,
): NeutralityRoot {
  let lo = -BRACKET_MARGIN;
  let hi = terms.epsG + BRACKET_MARGIN;
  let eta = guessEta;
  if (!(eta > lo && eta < hi)) eta = startingEta(g, terms, doping, lo, hi);
  const out = { slope: 0 };
  for (let step = 1; step <= NEWTON_MAX_STEPS; step++) {
    const value = g.valueAndSlope(eta, out);
    if (value === 0) return { eta, newtonSteps: step, converged: true };
    if (value > 0) lo = eta;
    else hi = eta;
    const next = eta - value / out.slope;
    // Newton converges quadratically: after a step of 1e-8 the error left is about
    // |g'' / 2g'| 1e-16, far below the rounding of g (1e-13 for eta near 1e3), so a stricter
    // test would only chase rounding noise. A step this small is taken only next to a root.
    if (Math.abs(next - eta) <= NEWTON_STEP_TOLERANCE) {
      return { eta: next, newtonSteps: step, converged: true };
    }
    eta = next > lo && next < hi ? next : 0.5 * (lo + hi);
  }
  const r = brentRoot((x) => g.value(x), -BRACKET_MARGIN, terms.epsG + BRACKET_MARGIN, 1e-10, 300);
  return { eta: r.root, newtonSteps: 0, converged: r.converged };
}

/** eta where the majority carrier equals the net doping (or midgap when compensated). */
function startingEta(
  g: NeutralityFunction,
  terms: TemperatureTerms,
  doping: ResolvedDoping,
  lo: number,
  hi: number,
): number {
  const net = doping.donorDensity - doping.acceptorDensity;
  let eta = 0.5 * (terms.lnNv - g.lnNcMinusG);
  if (net > 0) eta = Math.max(eta, Math.log(net) - g.lnNcMinusG);
  else if (net < 0) eta = Math.min(eta, terms.lnNv - Math.log(-net));
  return Math.min(Math.max(eta, lo + 1), hi - 1);
}
