/**
 * Resistivity of a doped semiconductor from both carriers, and the model curve rho(T).
 */
import { ELEMENTARY_CHARGE_C } from '../constants';
import { PHYSICS_DEFAULTS } from '../defaults';
import { logAddExp } from '../numeric/log-math';
import { requireArray, requirePositive, requireTemperatureK } from '../validate';
import type { BandModelOptions, DensityOfStatesSet } from './density-of-states';
import { resolveDensityOfStatesSet } from './density-of-states';
import type { Doping, ResolvedDoping } from './dopants';
import { resolveDoping } from './dopants';
import type { SemiconductorId } from './material';
import { requireSemiconductor } from './material';
import type { MobilityOptions, MobilityTerms } from './mobility';
import { mobilityAt, mobilityTermsAtLn, resolveMobilityModel } from './mobility';
import type { Regime } from './neutrality';
import { regimeAt } from './neutrality';
import type { DopingLogs, TemperatureTerms } from './neutrality-solve';
import {
  dopingLogs,
  neutralityFunction,
  neutralityRoot,
  temperatureTerms,
} from './neutrality-solve';
import type { MobilityModelId } from '../defaults';

/** Options of the resistivity model. */
export interface ResistivityOptions extends BandModelOptions, MobilityOptions {
  /** Factor applied to both mobilities (a fit parameter for sample quality); default 1. */
  mobilityScale?: number;
}

/** @internal A checked, resolved model configuration. */
export interface ResolvedModel {
  material: SemiconductorId;
  set: DensityOfStatesSet;
  mobilityModel: MobilityModelId;
  mobilityScale: number;
}

/** @internal Checks the options shared by the resistivity functions. */
export function resolveModel(
  fn: string,
  material: SemiconductorId,
  options: ResistivityOptions | undefined,
): ResolvedModel {
  const o = options ?? {};
  return {
    material,
    set: resolveDensityOfStatesSet(fn, material, o.densityOfStatesSet),
    mobilityModel: resolveMobilityModel(fn, material, o.mobilityModel),
    mobilityScale:
      o.mobilityScale === undefined ? 1 : requirePositive(fn, 'mobilityScale', o.mobilityScale),
  };
}

/** One point of the model curve. */
export interface ModelPoint {
  temperatureK: number;
  resistivityOhmCm: number;
  /** cm^-3 */
  electrons: number;
  /** cm^-3 */
  holes: number;
  /** cm^2/(V s) */
  electronMobility: number;
  /** cm^2/(V s) */
  holeMobility: number;
  regime: Regime;
}

const LN_Q = Math.log(ELEMENTARY_CHARGE_C);
const LN_CEILING = Math.log(PHYSICS_DEFAULTS.resistivityCeilingOhmCm);

/** @internal Everything of the model that depends on temperature only, shared across dopings. */
export interface CurveTerms {
  neutral: TemperatureTerms;
  electron: MobilityTerms;
  hole: MobilityTerms;
}

/** @internal The temperature-only terms of the model at one temperature. */
export function curveTerms(model: ResolvedModel, temperatureK: number): CurveTerms {
  const { material, set, mobilityModel } = model;
  const lnTn = Math.log(temperatureK / 300);
  return {
    neutral: temperatureTerms(material, set, temperatureK),
    electron: mobilityTermsAtLn(material, 'electron', lnTn, mobilityModel),
    hole: mobilityTermsAtLn(material, 'hole', lnTn, mobilityModel),
  };
}

/** @internal A model point with ln(rho) and the neutrality root eta (a start for the next). */
export type SolvedModelPoint = ModelPoint & { lnResistivity: number; eta: number };

/** @internal What `modelPointInto` writes beside the point it returns. */
export interface ModelPointRoot {
  lnResistivity: number;
  eta: number;
}

/**
 * @internal Model point from precomputed temperature terms, the solve started at `guessEta`;
 * ln(rho) and the root are written to `root`. `logs` may be taken once for many temperatures.
 */
export function modelPointInto(
  model: ResolvedModel,
  doping: ResolvedDoping,
  terms: CurveTerms,
  guessEta: number,
  logs: DopingLogs,
  root: ModelPointRoot,
): ModelPoint {
  const g = neutralityFunction(terms.neutral, doping, logs);
  const eta = neutralityRoot(g, terms.neutral, doping, guessEta).eta;
  const lnN = g.lnNcMinusG + eta;
  const lnP = terms.neutral.lnNv - eta;
  const muN = model.mobilityScale * mobilityAt(terms.electron, logs.lnTotal);
  const muP = model.mobilityScale * mobilityAt(terms.hole, logs.lnTotal);
  const lnRho = -(LN_Q + logAddExp(lnN + Math.log(muN), lnP + Math.log(muP)));
  root.lnResistivity = lnRho;
  root.eta = eta;
  return {
    temperatureK: terms.neutral.temperatureK,
    resistivityOhmCm:
      lnRho >= LN_CEILING ? PHYSICS_DEFAULTS.resistivityCeilingOhmCm : Math.exp(lnRho),
    electrons: Math.exp(lnN),
    holes: Math.exp(lnP),
    electronMobility: muN,
    holeMobility: muP,
    regime: regimeAt(terms.neutral, doping, logs, lnN, lnP),
  };
}

/** @internal `modelPointInto` with ln(rho) and the root on the point. */
export function modelPointAt(
  model: ResolvedModel,
  doping: ResolvedDoping,
  terms: CurveTerms,
  guessEta = Number.NaN,
  logs = dopingLogs(doping),
): SolvedModelPoint {
  const root = { lnResistivity: 0, eta: 0 };
  const point = modelPointInto(model, doping, terms, guessEta, logs, root);
  return { ...point, ...root };
}

/** @internal Model point and ln(rho), without input checks. */
export function modelPointUnchecked(
  model: ResolvedModel,
  doping: ResolvedDoping,
  temperatureK: number,
): SolvedModelPoint {
  return modelPointAt(model, doping, curveTerms(model, temperatureK));
}

/**
 * Resistivity of a doped semiconductor.
 *
 * Formula: rho = 1 / (q (n mu_n + p mu_p)), n and p from `carrierDensities`, mu from `mobility`
 * with the total impurity density N_D + N_A, both mobilities times `mobilityScale`.
 * Computed as ln(rho) internally; a value above `PHYSICS_DEFAULTS.resistivityCeilingOhmCm`
 * (1e300 ohm cm, reached only by nearly undoped material at a few kelvin) is reported as that
 * ceiling rather than as Infinity.
 * Assumptions: those of `carrierDensities` and `mobility`; no hopping or impurity-band conduction
 * in deep freeze-out.
 *
 * @param material semiconductor id
 * @param doping donor and acceptor densities (cm^-3) and levels (eV)
 * @param temperatureK temperature, K (1 to 1500)
 * @param options density-of-states set, mobility model, mobility scale
 * @returns resistivity, ohm cm
 * @example resistivity('Si', { donorDensity: 1e15, acceptorDensity: 0 }, 300) // 4.72 (ohm cm)
 */
export function resistivity(
  material: SemiconductorId,
  doping: Doping,
  temperatureK: number,
  options: ResistivityOptions = {},
): number {
  const m = requireSemiconductor('resistivity', material);
  const d = resolveDoping('resistivity', m, doping, options?.ionizationModel);
  const t = requireTemperatureK('resistivity', temperatureK);
  return modelPointUnchecked(resolveModel('resistivity', m, options), d, t).resistivityOhmCm;
}

/**
 * The model curve: resistivity, carrier densities, mobilities and regime at each temperature.
 *
 * Same model as `resistivity`; the temperatures are used in the order given.
 *
 * @param material semiconductor id
 * @param doping donor and acceptor densities (cm^-3) and levels (eV)
 * @param temperaturesK temperatures, K (each 1 to 1500)
 * @param options density-of-states set, mobility model, mobility scale
 * @example modelCurve('Si', { donorDensity: 1e15, acceptorDensity: 0 }, [300])[0].regime
 *   // 'extrinsic'
 */
export function modelCurve(
  material: SemiconductorId,
  doping: Doping,
  temperaturesK: number[],
  options: ResistivityOptions = {},
): ModelPoint[] {
  const m = requireSemiconductor('modelCurve', material);
  const d = resolveDoping('modelCurve', m, doping, options?.ionizationModel);
  const temps = requireArray('modelCurve', 'temperaturesK', temperaturesK);
  const checked = temps.map((t, i) => requireTemperatureK('modelCurve', t, `temperaturesK[${i}]`));
  const model = resolveModel('modelCurve', m, options);
  const logs = dopingLogs(d);
  // Each temperature's solve starts from the Fermi level (eV) extrapolated from its two
  // neighbours, rescaled to kT: a start within about 1e-4 needs two Newton steps.
  const previous = { t0: Number.NaN, e0: Number.NaN, t1: Number.NaN, e1: Number.NaN };
  const root = { lnResistivity: 0, eta: 0 };
  return checked.map((t) => {
    const terms = curveTerms(model, t);
    const slope = (previous.e1 - previous.e0) / (previous.t1 - previous.t0);
    const guessEv = previous.e1 + (Number.isFinite(slope) ? slope * (t - previous.t1) : 0);
    const point = modelPointInto(model, d, terms, guessEv / terms.neutral.kT, logs, root);
    previous.t0 = previous.t1;
    previous.e0 = previous.e1;
    previous.t1 = t;
    previous.e1 = root.eta * terms.neutral.kT;
    return point;
  });
}
