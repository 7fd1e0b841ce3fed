/**
 * The model's ln rho at one temperature with its derivatives with respect to the resolved
 * doping, by the implicit-function theorem on the neutrality equation: the analytic Jacobian of
 * `fitModel`.
 */
import { ELEMENTARY_CHARGE_C } from '../constants';
import { logAddExp } from '../numeric/log-math';
import type { ResolvedDoping } from './dopants';
import { mobilityAt, mobilitySlopeAt } from './mobility';
import type { NeutralityPartials } from './neutrality-solve';
import { dopingLogs, neutralityFunction, neutralityRoot } from './neutrality-solve';
import type { CurveTerms, ResolvedModel } from './resistivity';

/** @internal ln rho, the root eta and d ln rho / d x for each resolved quantity x. */
export interface LnResistivityGradient {
  lnResistivity: number;
  eta: number;
  /** Per cm^-3 (through the Fermi level and the mobilities' total density). */
  donorDensity: number;
  acceptorDensity: number;
  /** Per eV (effective levels). */
  donorLevelEv: number;
  acceptorLevelEv: number;
  donorBoundFraction: number;
  acceptorBoundFraction: number;
  /** Per unit ln mobilityScale. */
  lnMobilityScale: number;
}

const LN_Q = Math.log(ELEMENTARY_CHARGE_C);
/** Scratch for the partials of g: the solve is synchronous, so one object serves every call. */
const gx: NeutralityPartials = {
  eta: 0,
  donorDensity: 0,
  acceptorDensity: 0,
  donorLevelEv: 0,
  acceptorLevelEv: 0,
  donorBoundFraction: 0,
  acceptorBoundFraction: 0,
};

/** @internal ln rho at one temperature and the neutrality root it came from. */
export interface LnResistivity {
  lnResistivity: number;
  eta: number;
}

/**
 * @internal ln rho alone, as `modelPointAt` computes it (the same operations, so the same bits)
 * without the densities, mobilities and regime a fit does not read; the root is solved from
 * `guessEta` and written to `out` with ln rho.
 */
export function lnResistivityAt(
  model: ResolvedModel,
  doping: ResolvedDoping,
  terms: CurveTerms,
  guessEta: number,
  out: LnResistivity,
  logs = dopingLogs(doping),
): void {
  const g = neutralityFunction(terms.neutral, doping, logs);
  const eta = neutralityRoot(g, terms.neutral, doping, guessEta).eta;
  const muN = model.mobilityScale * mobilityAt(terms.electron, logs.lnTotal);
  const muP = model.mobilityScale * mobilityAt(terms.hole, logs.lnTotal);
  const lnN = g.lnNcMinusG + eta;
  const lnP = terms.neutral.lnNv - eta;
  out.lnResistivity = -(LN_Q + logAddExp(lnN + Math.log(muN), lnP + Math.log(muP)));
  out.eta = eta;
}

/**
 * @internal ln rho as `modelPointAt` computes it (the same operations, so the same bits) and its
 * derivatives, written to `out`. With ln rho = -ln q - ln(n mu_n + p mu_p), n = Nc e^(eta - Eg/kT),
 * p = Nv e^-eta and the shares w_n = n mu_n / (n mu_n + p mu_p), w_p = 1 - w_n:
 * d ln rho / dx = -(w_n - w_p) d eta / dx - w_n d ln mu_n / dx - w_p d ln mu_p / dx, with
 * d eta / dx = -(dg/dx) / (dg/d eta) at the root of the neutrality function g
 * (implicit-function theorem) and mu depending on x only through N_D + N_A.
 */
export function lnResistivityGradientAt(
  model: ResolvedModel,
  doping: ResolvedDoping,
  terms: CurveTerms,
  guessEta: number,
  out: LnResistivityGradient,
  logs = dopingLogs(doping),
): void {
  const g = neutralityFunction(terms.neutral, doping, logs);
  const eta = neutralityRoot(g, terms.neutral, doping, guessEta).eta;
  g.partials(eta, gx);
  const lnN = g.lnNcMinusG + eta;
  const lnP = terms.neutral.lnNv - eta;
  const total = doping.donorDensity + doping.acceptorDensity;
  const lnTotal = logs.lnTotal;
  const muN0 = mobilityAt(terms.electron, lnTotal);
  const muP0 = mobilityAt(terms.hole, lnTotal);
  const muN = model.mobilityScale * muN0;
  const muP = model.mobilityScale * muP0;
  const a = lnN + Math.log(muN);
  const b = lnP + Math.log(muP);
  const lnSigmaOverQ = logAddExp(a, b);
  const wN = Math.exp(a - lnSigmaOverQ);
  const wP = Math.exp(b - lnSigmaOverQ);
  // d ln rho / dx through eta alone is -(w_n - w_p) d eta / dx = k dg/dx.
  const k = (wN - wP) / gx.eta;
  const perLnTotal = -(
    (wN * mobilitySlopeAt(terms.electron, lnTotal)) / muN0 +
    (wP * mobilitySlopeAt(terms.hole, lnTotal)) / muP0
  );
  const mobilityPerDensity = total > 0 ? perLnTotal / total : 0;
  out.lnResistivity = -(LN_Q + lnSigmaOverQ);
  out.eta = eta;
  out.donorDensity = k * gx.donorDensity + mobilityPerDensity;
  out.acceptorDensity = k * gx.acceptorDensity + mobilityPerDensity;
  out.donorLevelEv = k * gx.donorLevelEv;
  out.acceptorLevelEv = k * gx.acceptorLevelEv;
  out.donorBoundFraction = k * gx.donorBoundFraction;
  out.acceptorBoundFraction = k * gx.acceptorBoundFraction;
  out.lnMobilityScale = -(wN + wP);
}
