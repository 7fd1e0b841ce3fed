import type { AnalysisStep, SpecCheckDto } from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';

/** 23 °C in kelvin: the temperature ASTM F723 and the lot specs refer to. */
export const SPEC_TEMPERATURE_K = PHYSICS_DEFAULTS.astmF723TemperatureK;
/** A nearest step may be this far from 23 °C and still be used, K (inclusive). */
export const MAX_NEAREST_DISTANCE_K = 5;
/** Interpolate only between steps at most this far apart, K (inclusive). */
export const MAX_INTERPOLATION_GAP_K = 10;

/**
 * Resistivity at temperature T between steps a and b, linear in ln(rho) against T. Used for
 * display alignment and the 23 °C value; no physics model is implied.
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

/** The 23 °C resistivity of a sweep, how it was obtained, or why there is none. */
export interface ValueAt23C {
  resistivityOhmCm: number | null;
  method: 'interpolated' | 'nearest' | null;
  distanceK: number | null;
  reason: string | null;
}

/**
 * Resistivity at 23 °C from averaged steps: interpolated between the steps either side of
 * 296.15 K when they are at most `MAX_INTERPOLATION_GAP_K` apart, otherwise the nearest step
 * when it lies within `MAX_NEAREST_DISTANCE_K`; none otherwise (with the reason).
 */
export function valueAt23C(steps: readonly AnalysisStep[]): ValueAt23C {
  if (steps.length === 0) {
    return {
      resistivityOhmCm: null,
      method: null,
      distanceK: null,
      reason: 'The sweep has no usable points',
    };
  }
  let nearest = steps[0]!;
  for (const s of steps) {
    if (
      Math.abs(s.temperatureK - SPEC_TEMPERATURE_K) <
      Math.abs(nearest.temperatureK - SPEC_TEMPERATURE_K)
    ) {
      nearest = s;
    }
  }
  const distanceK = Math.abs(nearest.temperatureK - SPEC_TEMPERATURE_K);
  const below = [...steps].reverse().find((s) => s.temperatureK <= SPEC_TEMPERATURE_K);
  const above = steps.find((s) => s.temperatureK >= SPEC_TEMPERATURE_K);
  if (below && above && above.temperatureK - below.temperatureK <= MAX_INTERPOLATION_GAP_K) {
    return {
      resistivityOhmCm: logLinear(below, above, SPEC_TEMPERATURE_K),
      method: 'interpolated',
      distanceK,
      reason: null,
    };
  }
  if (distanceK <= MAX_NEAREST_DISTANCE_K) {
    return {
      resistivityOhmCm: nearest.resistivityOhmCm,
      method: 'nearest',
      distanceK,
      reason: null,
    };
  }
  return {
    resistivityOhmCm: null,
    method: null,
    distanceK,
    reason:
      `The sweep does not cover 23 °C: its nearest step is ${distanceK.toFixed(2)} K away ` +
      `(at most ${MAX_NEAREST_DISTANCE_K} K allowed) and no steps at most ` +
      `${MAX_INTERPOLATION_GAP_K} K apart bracket 296.15 K`,
  };
}

/** Inclusive spec verdict; null when the lot has no limits or there is no value. */
export function specVerdict(
  resistivityOhmCm: number | null,
  specMinOhmCm: number | null,
  specMaxOhmCm: number | null,
): { inSpec: boolean | null; reason: string | null } {
  if (resistivityOhmCm === null) return { inSpec: null, reason: 'No resistivity at 23 °C' };
  if (specMinOhmCm === null && specMaxOhmCm === null) {
    return { inSpec: null, reason: 'The lot has no resistivity spec' };
  }
  const okMin = specMinOhmCm === null || resistivityOhmCm >= specMinOhmCm;
  const okMax = specMaxOhmCm === null || resistivityOhmCm <= specMaxOhmCm;
  return { inSpec: okMin && okMax, reason: null };
}

/** The spec block of the sweep analysis. */
export function specCheck(
  steps: readonly AnalysisStep[],
  specMinOhmCm: number | null,
  specMaxOhmCm: number | null,
): SpecCheckDto {
  const v = valueAt23C(steps);
  const verdict = specVerdict(v.resistivityOhmCm, specMinOhmCm, specMaxOhmCm);
  return {
    resistivityAt23COhmCm: v.resistivityOhmCm,
    inSpec: verdict.inSpec,
    specMinOhmCm,
    specMaxOhmCm,
    method: v.method,
    distanceK: v.distanceK,
    reason: v.reason ?? verdict.reason,
  };
}
