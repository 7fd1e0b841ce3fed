/**
 * Full-model fit of a measured rho(T) sweep: dopant densities, levels and a mobility scale.
 */
import { requireArray, requireObject, requireOneOf } from '../validate';
import type { Doping } from '../semiconductor/dopants';
import {
  checkDoping,
  ionizeDoping,
  MAX_DOPING_CM3,
  resolveIonizationModel,
} from '../semiconductor/dopants';
import type { SemiconductorId } from '../semiconductor/material';
import { requireSemiconductor } from '../semiconductor/material';
import type { ResistivityOptions } from '../semiconductor/resistivity';
import { curveTerms, resolveModel } from '../semiconductor/resistivity';
import { lnResistivityAt } from '../semiconductor/resistivity-gradient';
import { dopingLogs } from '../semiconductor/neutrality-solve';
import type { FitResult, ParameterScale } from './fit-result';
import { FIT_PARAMETER_WORDS, parameterWords } from './fit-result';
import { readPoints } from './points';
import { fitLnRhoSteps } from './step-levenberg';
import type { StepOptions } from './steps';
import { readStepOptions } from './steps';
import { densityCoordinates } from './model-densities';
import type { CurveAt, ResolvedParameters } from './model-jacobian';
import { lnModelGradient } from './model-jacobian';

/** Parameters `fitModel` can free. */
export type ModelParameter =
  'donorDensity' | 'acceptorDensity' | 'donorLevel' | 'acceptorLevel' | 'mobilityScale';

const PARAMETERS: readonly ModelParameter[] = [
  'donorDensity',
  'acceptorDensity',
  'donorLevel',
  'acceptorLevel',
  'mobilityScale',
];
/** Fitted on a log scale: positive quantities spanning decades. */
const LOG_SCALE: ReadonlySet<ModelParameter> = new Set([
  'donorDensity',
  'acceptorDensity',
  'mobilityScale',
]);
/** Bounds of the levels (eV) and the mobility scale; a result this close to one is flagged. */
const LEVEL_RANGE_EV: [number, number] = [0, 1];
const MOBILITY_SCALE_RANGE: [number, number] = [1e-6, 1e6];
/** A compensation ratio above this is reported as at its bound (minority = majority). */
const MAX_COMPENSATION_RATIO = 0.999;

/** Options of `fitModel`: the model's and the dwell steps'. */
export type ModelFitOptions = ResistivityOptions & StepOptions;

/** Result of `fitModel` (parameters: densities cm^-3, levels eV, mobilityScale). */
export type ModelFit = FitResult<ModelParameter>;

/**
 * Least-squares fit of the resistivity model (`resistivity`) to a measured sweep.
 *
 * Method: Levenberg–Marquardt on ln rho_model(T) against the dwell-step means of ln rho
 * (`dwellSteps`, weights 1 / variance of each mean plus the effective variance of
 * `temperatureUncertaintyK`), covariance (J^T J)^-1 chi^2 / (steps - k), intervals with Student's
 * t at steps - k degrees of freedom, none when the fit has not converged.
 * The conduction type of the starting guess is kept: with both densities free the fit runs on
 * ln N_net = ln |N_D - N_A| and the compensation ratio r = N_minority / N_majority through
 * logit r (0 < r < 1), reported back as N_D and N_A (delta method); with one free, the minority
 * density stays below the majority. Without this, data that only fix N_net (extrinsic-only
 * sweeps) let the fit wander to the other type. Levels (eV) and the mobility scale are fitted
 * directly and as a logarithm. Densities and the mobility scale have log-scale intervals,
 * exp(ln P ± t se(ln P)); the correlation matrix is that of the fitted coordinates as reported
 * (ln densities, levels, ln mobility scale).
 * Fixed parameters keep their `initial` values; a free level without an initial value starts at
 * the material's default level; `mobilityScale` starts at 1 unless `options.mobilityScale` says
 * otherwise. Levels are the isolated (dilute-limit) ionization energies E0, lowered with density
 * exactly as `resistivity` does. Warnings: `standardWarnings`, and a parameter at a bound.
 * Assumptions: equal relative errors within a step; those of `resistivity`.
 *
 * @param points measured { temperatureK, resistivityOhmCm } (more steps than free parameters)
 * @param material semiconductor id
 * @param initial starting doping (free densities must be above 0, N_D ≠ N_A when both are free)
 * @param free names of the parameters to fit
 * @param options model options (density-of-states set, mobility model, starting mobility
 *   scale) and step options
 */
export function fitModel(
  points: Array<{ temperatureK: number; resistivityOhmCm: number }>,
  material: SemiconductorId,
  initial: Doping,
  free: ModelParameter[],
  options: ModelFitOptions = {},
): ModelFit {
  const fn = 'fitModel';
  const m = requireSemiconductor(fn, material);
  const start = checkDoping(fn, m, initial);
  const ionization = resolveIonizationModel(fn, m, options?.ionizationModel);
  const stepOptions = readStepOptions(fn, requireObject(fn, 'options', options ?? {}));
  const freeList = requireArray(fn, 'free', free, 1).map((f, i) =>
    requireOneOf(fn, `free[${i}]`, f, PARAMETERS),
  );
  if (new Set(freeList).size !== freeList.length)
    throw new RangeError(`\`${fn}\` requires free to list each parameter once`);
  const model = resolveModel(fn, m, options);
  const [temps, rhos] = readPoints(
    fn,
    points,
    ['temperatureK', 'resistivityOhmCm'],
    freeList.length + 1,
  ) as [Float64Array, Float64Array];
  for (let i = 0; i < temps.length; i++) {
    if (temps[i]! < 1 || temps[i]! > 1500) {
      throw new RangeError(
        `\`${fn}\` requires points[${i}].temperatureK between 1 K and 1500 K, got ${temps[i]}`,
      );
    }
  }
  const values: Record<ModelParameter, number> = {
    donorDensity: start.donorDensity,
    acceptorDensity: start.acceptorDensity,
    donorLevel: start.donorLevel0Ev,
    acceptorLevel: start.acceptorLevel0Ev,
    mobilityScale: model.mobilityScale,
  };
  for (const f of freeList) {
    if (LOG_SCALE.has(f) && !(values[f] > 0)) {
      throw new RangeError(
        `\`${fn}\` requires a starting ${f} above 0 when it is free, got ${values[f]}`,
      );
    }
  }
  const nType = values.donorDensity >= values.acceptorDensity;
  const densities = densityCoordinates(fn, freeList, values, nType);
  const others = freeList.filter((f) => f !== 'donorDensity' && f !== 'acceptorDensity');
  const names: ModelParameter[] = [...densities.names, ...others];
  const scales: ParameterScale[] = names.map((f) => (LOG_SCALE.has(f) ? 'log' : 'linear'));
  const unpack = (q: readonly number[]): Record<ModelParameter, number> => {
    const v = { ...values, ...densities.unpack(q) };
    others.forEach((f, i) => {
      const x = q[densities.size + i]!;
      v[f] = LOG_SCALE.has(f) ? Math.exp(x) : x;
    });
    return v;
  };
  // The fit evaluates the model at the same step temperatures for every parameter set: the
  // temperature-only terms are computed once per temperature and each neutrality solve starts
  // from that temperature's last root.
  const curve = new Map<number, CurveAt>();
  const curveAt = (t: number): CurveAt => {
    let at = curve.get(t);
    if (!at) {
      at = { terms: curveTerms(model, t), eta: Number.NaN };
      curve.set(t, at);
    }
    return at;
  };
  const resolveUnchecked = (q: readonly number[]): ResolvedParameters => {
    const v = unpack(q);
    const doping = ionizeDoping(
      m,
      ionization,
      v.donorDensity,
      v.acceptorDensity,
      v.donorLevel,
      v.acceptorLevel,
    );
    return {
      doping,
      model: { ...model, mobilityScale: v.mobilityScale },
      logs: dopingLogs(doping),
    };
  };
  const resolve = (q: readonly number[]): ResolvedParameters | null => {
    const v = unpack(q);
    const feasible =
      v.donorDensity <= MAX_DOPING_CM3 &&
      v.acceptorDensity <= MAX_DOPING_CM3 &&
      (nType ? v.acceptorDensity < v.donorDensity : v.donorDensity < v.acceptorDensity) &&
      v.donorLevel > LEVEL_RANGE_EV[0] &&
      v.donorLevel <= LEVEL_RANGE_EV[1] &&
      v.acceptorLevel > LEVEL_RANGE_EV[0] &&
      v.acceptorLevel <= LEVEL_RANGE_EV[1] &&
      v.mobilityScale > MOBILITY_SCALE_RANGE[0] &&
      v.mobilityScale < MOBILITY_SCALE_RANGE[1];
    return feasible ? resolveUnchecked(q) : null;
  };
  const lnModel = (q: readonly number[]): ((t: number) => number) | null => {
    const r = resolve(q);
    if (!r) return null;
    const out = { lnResistivity: 0, eta: 0 };
    return (t) => {
      const at = curveAt(t);
      lnResistivityAt(r.model, r.doping, at.terms, at.eta, out, r.logs);
      at.eta = out.eta;
      return out.lnResistivity;
    };
  };
  const initialCoordinates = [
    ...densities.initial,
    ...others.map((f) => (LOG_SCALE.has(f) ? Math.log(values[f]) : values[f])),
  ];
  const fit = fitLnRhoSteps<ModelParameter>({
    fn,
    temperaturesK: temps,
    resistivitiesOhmCm: rhos,
    toleranceK: stepOptions.toleranceK,
    temperatureUncertaintyK: stepOptions.temperatureUncertaintyK,
    names,
    scales,
    initial: initialCoordinates,
    lnModel,
    lnModelGradient: (q) => lnModelGradient(q, resolve, resolveUnchecked, curveAt),
    reported: (q, cov) => densities.reported(q, cov),
    parametersOf: unpack,
  });
  fit.warnings.push(...boundWarnings(fit, nType));
  return fit;
}

function boundWarnings(fit: ModelFit, nType: boolean): string[] {
  const p = fit.parameters;
  const out: string[] = [];
  const [majority, minority] = nType
    ? (['donorDensity', 'acceptorDensity'] as const)
    : (['acceptorDensity', 'donorDensity'] as const);
  if (fit.fitted.includes(minority) && p[minority] > MAX_COMPENSATION_RATIO * p[majority]) {
    out.push(
      `${parameterWords(minority)} is at its bound: it has reached ` +
        `${FIT_PARAMETER_WORDS[majority]} (the fit keeps the starting ` +
        `${nType ? 'n' : 'p'}-type), so the data do not separate the two densities.`,
    );
  }
  for (const level of ['donorLevel', 'acceptorLevel'] as const) {
    if (!fit.fitted.includes(level)) continue;
    if (p[level] < 0.002 || p[level] > LEVEL_RANGE_EV[1] - 0.002)
      out.push(
        `${parameterWords(level)} is at a bound of its range (0 to 1 eV): ` +
          `${p[level].toFixed(4)} eV.`,
      );
  }
  const s = p.mobilityScale;
  if (fit.fitted.includes('mobilityScale') && (s < 1e-5 || s > 1e5))
    out.push(`The mobility scale is at a bound of its range (1e-6 to 1e6): ${s.toPrecision(3)}.`);
  return out;
}
