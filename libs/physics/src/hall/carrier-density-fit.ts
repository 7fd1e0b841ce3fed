/**
 * Charge-neutrality fit of a measured carrier density n(T) (Hall): donor and acceptor densities
 * and levels.
 */
import type { DensityOfStatesSetId, IonizationModelId } from '../defaults';
import type { FitResult, ParameterScale } from '../fit/fit-result';
import { densityCoordinates } from '../fit/model-densities';
import type { ModelParameter } from '../fit/model-fit';
import { readPoints } from '../fit/points';
import { fitLnRhoSteps } from '../fit/step-levenberg';
import type { StepOptions } from '../fit/steps';
import { readStepOptions } from '../fit/steps';
import { resolveDensityOfStatesSet } from '../semiconductor/density-of-states';
import type { Doping } from '../semiconductor/dopants';
import {
  checkDoping,
  ionizeDoping,
  MAX_DOPING_CM3,
  resolveIonizationModel,
} from '../semiconductor/dopants';
import type { SemiconductorId } from '../semiconductor/material';
import { requireSemiconductor } from '../semiconductor/material';
import { solveNeutrality } from '../semiconductor/neutrality';
import { requireArray, requireObject, requireOneOf } from '../validate';
import { temperatureWindow } from './window';

/** Parameters `fitCarrierDensity` can free. */
export type CarrierDensityParameter =
  'donorDensity' | 'acceptorDensity' | 'donorLevel' | 'acceptorLevel';

const PARAMETERS: readonly CarrierDensityParameter[] = [
  'donorDensity',
  'acceptorDensity',
  'donorLevel',
  'acceptorLevel',
];
const LEVEL_RANGE_EV: [number, number] = [0, 1];

/** Options of `fitCarrierDensity`. */
export interface CarrierDensityFitOptions extends StepOptions {
  /** Window, K (inclusive). */
  minK?: number;
  maxK?: number;
  /**
   * Ionization model; default `constant-level`: the fitted levels are the sample's own
   * (what its freeze-out slope measures), not dilute-limit levels lowered with density.
   */
  ionizationModel?: IonizationModelId;
  /** Density-of-states set; default per material (`PHYSICS_DEFAULTS.densityOfStatesSet`). */
  densityOfStatesSet?: DensityOfStatesSetId;
}

/** Result of `fitCarrierDensity` (densities cm^-3, levels eV). */
export type CarrierDensityFit = FitResult<CarrierDensityParameter>;

/**
 * Least-squares fit of charge neutrality with incomplete ionization to a Hall n(T).
 *
 * Model: the majority carrier density of `carrierDensities` (n for a sample that starts n-type,
 * N_D >= N_A, else p): n + N_A^- = p + N_D^+ with
 * N_D^+ = N_D / (1 + 2 exp((E_F - E_c + E_d)/kT)); in the freeze-out range this gives
 * n ~ sqrt(Nc N_D / 2) exp(-E_d / 2kT) when n >> N_A and n ~ (Nc / 2)(N_D - N_A)/N_A
 * exp(-E_d / kT) when n << N_A (Blakemore 1962; Look 1989, ch. 1).
 * Method: as `fitModel`, Levenberg–Marquardt on the dwell-step means of ln n with the same
 * density coordinates (ln N_net and the compensation ratio when both densities are free, so the
 * conduction type of the start is kept), covariance (J^T J)^-1 chi^2 / (steps - k), Student's t
 * intervals (log scale for densities), none without convergence. Residuals ln(n / model).
 * Assumptions: one carrier type carries the Hall signal (mixed conduction near the intrinsic
 * range is not modelled: keep maxK below it); the densities are Hall densities already divided
 * by the Hall factor used at import; Boltzmann statistics; one donor and one acceptor level.
 *
 * @param points measured { temperatureK, densityCm3 } (more steps than free parameters)
 * @param material semiconductor id
 * @param initial starting doping (free densities above 0; N_D ≠ N_A when both are free)
 * @param free parameters to fit
 * @param options window, ionization model, density-of-states set, step options
 * @example fitCarrierDensity(points, 'Si', { donorDensity: 1e15, acceptorDensity: 1e13,
 *   donorLevel: 0.045 }, ['donorDensity', 'acceptorDensity', 'donorLevel'])
 */
export function fitCarrierDensity(
  points: Array<{ temperatureK: number; densityCm3: number }>,
  material: SemiconductorId,
  initial: Doping,
  free: Array<CarrierDensityParameter>,
  options: CarrierDensityFitOptions = {},
): CarrierDensityFit {
  const fn = 'fitCarrierDensity';
  const m = requireSemiconductor(fn, material);
  const start = checkDoping(fn, m, initial);
  const o = requireObject(fn, 'options', options ?? {});
  const ionization = resolveIonizationModel(fn, m, o['ionizationModel'] ?? 'constant-level');
  const set = resolveDensityOfStatesSet(fn, m, o['densityOfStatesSet']);
  const stepOptions = readStepOptions(fn, o);
  const freeList = requireArray(fn, 'free', free, 1).map((f, i) =>
    requireOneOf(fn, `free[${i}]`, f, PARAMETERS),
  );
  if (new Set(freeList).size !== freeList.length)
    throw new RangeError(`\`${fn}\` requires free to list each parameter once`);
  const [allT, allN] = readPoints(fn, points, ['temperatureK', 'densityCm3'], 1) as [
    Float64Array,
    Float64Array,
  ];
  allT.forEach((t, i) => {
    if (t < 1 || t > 1500) {
      throw new RangeError(
        `\`${fn}\` requires points[${i}].temperatureK between 1 K and 1500 K, got ${t}`,
      );
    }
  });
  const keep = temperatureWindow(fn, o, allT);
  const temps = Float64Array.from(keep, (i) => allT[i]!);
  const densitiesCm3 = Float64Array.from(keep, (i) => allN[i]!);
  const values: Record<ModelParameter, number> = {
    donorDensity: start.donorDensity,
    acceptorDensity: start.acceptorDensity,
    donorLevel: start.donorLevel0Ev,
    acceptorLevel: start.acceptorLevel0Ev,
    mobilityScale: 1,
  };
  for (const f of freeList) {
    if ((f === 'donorDensity' || f === 'acceptorDensity') && !(values[f] > 0)) {
      throw new RangeError(
        `\`${fn}\` requires a starting ${f} above 0 when it is free, got ${values[f]}`,
      );
    }
  }
  const nType = values.donorDensity >= values.acceptorDensity;
  const densities = densityCoordinates(fn, freeList, values, nType);
  const levels = freeList.filter(
    (f): f is 'donorLevel' | 'acceptorLevel' => f === 'donorLevel' || f === 'acceptorLevel',
  );
  const names: CarrierDensityParameter[] = [...densities.names, ...levels];
  const scales: ParameterScale[] = names.map((f) => (f.endsWith('Density') ? 'log' : 'linear'));
  const unpack = (q: readonly number[]): Record<CarrierDensityParameter, number> => {
    const v = { ...values, ...densities.unpack(q) };
    levels.forEach((f, i) => (v[f] = q[densities.size + i]!));
    const { mobilityScale: _unused, ...rest } = v;
    return rest;
  };
  const lnModel = (q: readonly number[]): ((t: number) => number) | null => {
    const v = unpack(q);
    const feasible =
      v.donorDensity <= MAX_DOPING_CM3 &&
      v.acceptorDensity <= MAX_DOPING_CM3 &&
      (nType ? v.acceptorDensity < v.donorDensity : v.donorDensity < v.acceptorDensity) &&
      v.donorLevel > LEVEL_RANGE_EV[0] &&
      v.donorLevel <= LEVEL_RANGE_EV[1] &&
      v.acceptorLevel > LEVEL_RANGE_EV[0] &&
      v.acceptorLevel <= LEVEL_RANGE_EV[1];
    if (!feasible) return null;
    const d = ionizeDoping(
      m,
      ionization,
      v.donorDensity,
      v.acceptorDensity,
      v.donorLevel,
      v.acceptorLevel,
    );
    return (t) => {
      const s = solveNeutrality(m, set, d, t);
      return nType ? s.lnElectrons : s.lnHoles;
    };
  };
  // The step core fits ln y for any positive y: here y is the carrier density, not rho.
  const fit = fitLnRhoSteps<CarrierDensityParameter>({
    fn,
    temperaturesK: temps,
    resistivitiesOhmCm: densitiesCm3,
    toleranceK: stepOptions.toleranceK,
    temperatureUncertaintyK: stepOptions.temperatureUncertaintyK,
    names,
    scales,
    initial: [...densities.initial, ...levels.map((f) => values[f])],
    lnModel,
    reported: (q, cov) => densities.reported(q, cov),
    parametersOf: unpack,
  });
  for (const level of levels) {
    const e = fit.parameters[level];
    if (e < 0.002 || e > LEVEL_RANGE_EV[1] - 0.002)
      fit.warnings.push(`${level} is at a bound of its range (0 to 1 eV): ${e.toFixed(4)} eV.`);
  }
  const [majority, minority] = nType
    ? (['donorDensity', 'acceptorDensity'] as const)
    : (['acceptorDensity', 'donorDensity'] as const);
  if (fit.fitted.includes(minority) && fit.parameters[minority] > 0.999 * fit.parameters[majority])
    fit.warnings.push(`${minority} has reached ${majority}: the data do not separate them.`);
  return fit;
}
