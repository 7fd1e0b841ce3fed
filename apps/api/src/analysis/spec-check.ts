import type {
  AnalysisStep,
  SpecCheckDto,
  SpecVerdict,
  ValueUncertainty,
} from '@rhotrace/api-types';
import { guardBandedVerdict } from '@rhotrace/physics';
import type { ValueAt23C } from './value-at-23c';

/**
 * Resistivity at temperature T between steps a and b, linear in ln(rho) against T. Used for
 * display alignment; no physics model is implied.
 */
export function logLinear(a: AnalysisStep, b: AnalysisStep, temperatureK: number): number {
  if (b.temperatureK === a.temperatureK) return a.resistivityOhmCm;
  const f = (temperatureK - a.temperatureK) / (b.temperatureK - a.temperatureK);
  return Math.exp(
    Math.log(a.resistivityOhmCm) +
      f * (Math.log(b.resistivityOhmCm) - Math.log(a.resistivityOhmCm)),
  );
}

/**
 * Resistivity at `temperatureK` within a sweep's own range (log-linear between the bracketing
 * steps), or null outside it. `steps` must be sorted by temperature.
 */
export function interpolateWithin(
  steps: readonly AnalysisStep[],
  temperatureK: number,
): number | null {
  const first = steps[0];
  const last = steps[steps.length - 1];
  if (!first || !last || temperatureK < first.temperatureK || temperatureK > last.temperatureK) {
    return null;
  }
  let lo = 0;
  let hi = steps.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (steps[mid]!.temperatureK <= temperatureK) lo = mid;
    else hi = mid;
  }
  return logLinear(steps[lo]!, steps[hi]!, temperatureK);
}

/** Guard-banded verdict (JCGM 106:2012, guard band w = U); null, with why, when there is none. */
export function specVerdict(
  resistivityOhmCm: number | null,
  uncertaintyOhmCm: number | null,
  specMinOhmCm: number | null,
  specMaxOhmCm: number | null,
): { verdict: SpecVerdict | null; reason: string | null } {
  if (resistivityOhmCm === null) return { verdict: null, reason: 'No resistivity at 23 °C' };
  if (specMinOhmCm === null && specMaxOhmCm === null) {
    return { verdict: null, reason: 'The lot has no resistivity spec' };
  }
  const verdict = guardBandedVerdict(
    resistivityOhmCm,
    uncertaintyOhmCm ?? 0,
    specMinOhmCm,
    specMaxOhmCm,
  );
  return {
    verdict,
    reason:
      verdict === 'indeterminate'
        ? 'The value lies within its expanded uncertainty (k = 2) of a spec limit'
        : null,
  };
}

/** The spec block of the sweep analysis. */
export function specCheck(
  value: ValueAt23C,
  uncertainty: ValueUncertainty,
  specMinOhmCm: number | null,
  specMaxOhmCm: number | null,
): SpecCheckDto {
  const v = specVerdict(
    value.resistivityOhmCm,
    uncertainty.uncertaintyOhmCm,
    specMinOhmCm,
    specMaxOhmCm,
  );
  return {
    resistivityAt23COhmCm: value.resistivityOhmCm,
    inSpec: v.verdict === null ? null : v.verdict === 'pass',
    verdict: v.verdict,
    ...uncertainty,
    specMinOhmCm,
    specMaxOhmCm,
    method: value.method,
    distanceK: value.distanceK,
    reason: value.reason ?? v.reason,
  };
}
