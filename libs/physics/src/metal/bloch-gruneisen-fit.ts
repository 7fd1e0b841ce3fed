/**
 * Bloch–Grüneisen fit of a measured metal rho(T), on dwell-step means.
 */
import type { FitResult } from '../fit/fit-result';
import { parameterWords } from '../fit/fit-result';
import { readPoints } from '../fit/points';
import { fitLnRhoSteps } from '../fit/step-levenberg';
import type { StepOptions } from '../fit/steps';
import { readStepOptions } from '../fit/steps';
import { requireObject } from '../validate';
import type { BlochGruneisenParameters } from './bloch-gruneisen';
import { blochGruneisenUnchecked } from './bloch-gruneisen';

/** Parameters of `fitBlochGruneisen` (ohm cm, ohm cm, K). */
export type BlochGruneisenParameter = keyof BlochGruneisenParameters;

/** Result of `fitBlochGruneisen`. */
export type BlochGruneisenFit = FitResult<BlochGruneisenParameter>;

/**
 * Fits rho_0, A and Theta of `blochGruneisen` to a measured sweep.
 *
 * Method: Levenberg–Marquardt on ln(rho_model) against the dwell-step means of ln rho
 * (`dwellSteps`; weights 1 / variance of each mean, plus the effective variance of
 * `temperatureUncertaintyK`), with rho_0 and A scaled by the largest measured rho and Theta
 * fitted as ln Theta; covariance (J^T J)^-1 chi^2 / (steps - 3); intervals with Student's t at
 * steps - 3 degrees of freedom, none when the fit has not converged. The correlation matrix is
 * that of (rho_0, A, ln Theta). Residuals: ln(observed / model) per reading.
 * Starting point, unless given: rho_0 = half the smallest rho, Theta = 300 K, A from the
 * high-temperature slope. Theta is only well determined when the data reach below about Theta/3.
 *
 * @param points measured { temperatureK, resistivityOhmCm }, at least 4 steps
 * @param initial optional starting parameters
 * @param options step tolerance and temperature uncertainty
 */
export function fitBlochGruneisen(
  points: Array<{ temperatureK: number; resistivityOhmCm: number }>,
  initial?: Partial<BlochGruneisenParameters>,
  options: StepOptions = {},
): BlochGruneisenFit {
  const fn = 'fitBlochGruneisen';
  const [temps, rhos] = readPoints(fn, points, ['temperatureK', 'resistivityOhmCm'], 4) as [
    Float64Array,
    Float64Array,
  ];
  const given = initial === undefined ? {} : requireObject(fn, 'initial', initial);
  const steps = readStepOptions(fn, requireObject(fn, 'options', options ?? {}));
  let rhoMax = 0;
  let rhoMin = Number.POSITIVE_INFINITY;
  let tMax = 0;
  for (let i = 0; i < temps.length; i++) {
    rhoMax = Math.max(rhoMax, rhos[i]!);
    rhoMin = Math.min(rhoMin, rhos[i]!);
    tMax = Math.max(tMax, temps[i]!);
  }
  const theta0 = typeof given['debyeK'] === 'number' && given['debyeK'] > 0 ? given['debyeK'] : 300;
  const rho00 = typeof given['residualOhmCm'] === 'number' ? given['residualOhmCm'] : rhoMin / 2;
  const a0 =
    typeof given['couplingOhmCm'] === 'number'
      ? given['couplingOhmCm']
      : Math.max(1e-12 * rhoMax, (4 * theta0 * (rhoMax - rho00)) / tMax);
  const scale = rhoMax;
  let tMin = Number.POSITIVE_INFINITY;
  for (let i = 0; i < temps.length; i++) tMin = Math.min(tMin, temps[i]!);
  const fit = fitLnRhoSteps<BlochGruneisenParameter>({
    fn,
    temperaturesK: temps,
    resistivitiesOhmCm: rhos,
    toleranceK: steps.toleranceK,
    temperatureUncertaintyK: steps.temperatureUncertaintyK,
    names: ['residualOhmCm', 'couplingOhmCm', 'debyeK'],
    scales: ['linear', 'linear', 'log'],
    factors: [scale, scale, 1],
    initial: [rho00 / scale, a0 / scale, Math.log(theta0)],
    lnModel: (q) => {
      const rho0 = q[0]! * scale;
      const a = q[1]! * scale;
      const theta = Math.exp(q[2]!);
      if (rho0 < 0 || a < 0 || !(theta > 0.1 && theta < 1e5)) return null;
      return (t) => Math.log(blochGruneisenUnchecked(t, rho0, a, theta));
    },
    parametersOf: (q) => ({
      residualOhmCm: q[0]! * scale,
      couplingOhmCm: q[1]! * scale,
      debyeK: Math.exp(q[2]!),
    }),
  });
  fit.warnings.push(...coverageWarnings(fit, tMin, rhoMax));
  return fit;
}

/**
 * Cautions particular to Bloch–Grüneisen: Theta is only pinned down by readings below about
 * Theta / 3, where rho(T) leaves its straight line (above it any Theta with a matching A fits);
 * and rho_0 or A pressed against their lower bound of 0.
 */
function coverageWarnings(fit: BlochGruneisenFit, lowestK: number, rhoMax: number): string[] {
  if (!fit.converged) return [];
  const out: string[] = [];
  const theta = fit.parameters.debyeK;
  if (lowestK > theta / 3) {
    out.push(
      `The readings start at ${lowestK.toFixed(1)} K, above a third of the fitted Debye ` +
        `temperature (${theta.toFixed(0)} K): there the curve is nearly straight, so the Debye ` +
        'temperature is weakly constrained by these data.',
    );
  }
  for (const name of ['residualOhmCm', 'couplingOhmCm'] as const) {
    // Zero within rounding of the largest reading: the fit pressed it against its bound.
    if (fit.parameters[name] <= 1e-9 * rhoMax)
      out.push(`${parameterWords(name)} is at its bound of 0.`);
  }
  return out;
}
