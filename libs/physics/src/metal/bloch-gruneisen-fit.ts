/**
 * Bloch–Grüneisen fit of a measured metal rho(T).
 */
import { levenbergMarquardt } from '../fit/levenberg-marquardt';
import { readPoints } from '../fit/points';
import { studentTCritical } from '../numeric/student-t';
import { requireObject } from '../validate';
import type { BlochGruneisenParameters } from './bloch-gruneisen';
import { blochGruneisenUnchecked } from './bloch-gruneisen';

type BgKey = keyof BlochGruneisenParameters;
const KEYS: readonly BgKey[] = ['residualOhmCm', 'couplingOhmCm', 'debyeK'];

/** Result of `fitBlochGruneisen`. */
export interface BlochGruneisenFit {
  parameters: BlochGruneisenParameters;
  /** Standard errors in the parameters' units (null: not identifiable from the data). */
  standardErrors: Record<BgKey, number | null>;
  confidenceIntervals95: Record<BgKey, [number, number] | null>;
  /** Root mean square of ln(rho_model / rho_measured). */
  residualRms: number;
  residuals: number[];
  iterations: number;
  converged: boolean;
  reason: string;
}

/**
 * Fits rho_0, A and Theta of `blochGruneisen` to a measured sweep.
 *
 * Method: Levenberg–Marquardt on ln(rho_model) - ln(rho_measured) (equal relative errors), with
 * rho_0 and A scaled by the largest measured rho and Theta fitted as ln Theta; covariance
 * (J^T J)^-1 s^2, s^2 = SSR / (n - 3); intervals with Student's t at n - 3 degrees of freedom.
 * Starting point, unless given: rho_0 = half the smallest rho, Theta = 300 K, A from the
 * high-temperature slope. Theta is only well determined when the data reach below about Theta/3.
 *
 * @param points measured { temperatureK, resistivityOhmCm }, at least 4
 * @param initial optional starting parameters
 */
export function fitBlochGruneisen(
  points: Array<{ temperatureK: number; resistivityOhmCm: number }>,
  initial?: Partial<BlochGruneisenParameters>,
): BlochGruneisenFit {
  const fn = 'fitBlochGruneisen';
  const [temps, rhos] = readPoints(fn, points, ['temperatureK', 'resistivityOhmCm'], 4) as [
    Float64Array,
    Float64Array,
  ];
  const given = initial === undefined ? {} : requireObject(fn, 'initial', initial);
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
  const lnRho = Array.from(rhos, Math.log);
  const residuals = (p: readonly number[]): Float64Array => {
    const out = new Float64Array(temps.length);
    const rho0 = p[0]! * scale;
    const a = p[1]! * scale;
    const theta = Math.exp(p[2]!);
    if (rho0 < 0 || a < 0 || !(theta > 0.1 && theta < 1e5)) return out.fill(Number.NaN);
    for (let i = 0; i < temps.length; i++) {
      out[i] = Math.log(blochGruneisenUnchecked(temps[i]!, rho0, a, theta)) - lnRho[i]!;
    }
    return out;
  };
  const lm = levenbergMarquardt({
    residuals,
    initial: [rho00 / scale, a0 / scale, Math.log(theta0)],
  });
  const [q0, q1, q2] = lm.parameters as [number, number, number];
  const parameters = { residualOhmCm: q0 * scale, couplingOhmCm: q1 * scale, debyeK: Math.exp(q2) };
  const dof = temps.length - 3;
  const s2 = lm.cost / dof;
  const t = studentTCritical(0.95, dof);
  const standardErrors = {} as BlochGruneisenFit['standardErrors'];
  const confidenceIntervals95 = {} as BlochGruneisenFit['confidenceIntervals95'];
  KEYS.forEach((key, i) => {
    const v = lm.unscaledCovariance ? lm.unscaledCovariance[i]![i]! * s2 : Number.NaN;
    if (!(v >= 0) || !Number.isFinite(v)) {
      standardErrors[key] = null;
      confidenceIntervals95[key] = null;
      return;
    }
    const se = Math.sqrt(v);
    if (key === 'debyeK') {
      standardErrors[key] = parameters.debyeK * se;
      confidenceIntervals95[key] = [Math.exp(q2 - t * se), Math.exp(q2 + t * se)];
    } else {
      const value = parameters[key];
      standardErrors[key] = se * scale;
      confidenceIntervals95[key] = [value - t * se * scale, value + t * se * scale];
    }
  });
  return {
    parameters,
    standardErrors,
    confidenceIntervals95,
    residualRms: Number.isFinite(lm.cost) ? Math.sqrt(lm.cost / temps.length) : Number.MAX_VALUE,
    residuals: lm.residuals.map((r) => (Number.isFinite(r) ? r : 0)),
    iterations: lm.iterations,
    converged: lm.converged,
    reason: lm.reason,
  };
}
