/**
 * Temperature steps of a planned sweep and the time the sweep takes.
 */
import { PhysicsInputError } from '../errors';
import {
  requireArray,
  requireFiniteNumber,
  requireNonNegative,
  requireObject,
  requireOneOf,
  requirePositive,
} from '../validate';

/** Most temperature steps one plan may hold (a day of 3-minute dwells is about 500). */
export const MAX_PLAN_STEPS = 500;

/**
 * Defaults of the planner, in one place (common practice, no source): the settling time at each
 * step, the ramp rate between steps, where a sweep starts and ends (room temperature), and the
 * factors that place the extra steps around a regime boundary.
 */
export const PLAN_DEFAULTS = {
  /** Time spent at each step once the stage has reached it (settling and reading), s. */
  dwellS: 120,
  /** Ramp rate of the stage between steps, K/min. */
  rampKPerMin: 5,
  /** The sweep starts from and returns to room temperature, K (23 °C). */
  roomTemperatureK: 296.15,
  /** Extra steps at these multiples of a regime boundary temperature. */
  denseFactors: [0.9, 0.95, 1.05, 1.1] as readonly number[],
  /** An extra step closer than this fraction to an existing step is left out. */
  mergeFraction: 0.01,
} as const;

/** How the steps are spread: evenly in T, or evenly in 1/T (an Arrhenius plot). */
export type StepSpacing = 'linear' | 'inverse';
const SPACINGS: readonly StepSpacing[] = ['linear', 'inverse'];

/**
 * `count` temperatures from `minK` to `maxK`, both ends included, in rising order.
 *
 * Formula: linear T_i = minK + (maxK - minK) i / (count - 1); inverse (evenly in 1/T, so an
 * Arrhenius plot gets evenly spaced points) 1/T_i = 1/minK - (1/minK - 1/maxK) i / (count - 1).
 * Source: definitions (common practice, no source).
 *
 * @param input minK and maxK (K, 0 < minK < maxK), count (whole, 2 to `MAX_PLAN_STEPS`), spacing
 * @returns temperatures, K
 * @example planTemperatureSteps({ minK: 20, maxK: 100, count: 10, spacing: 'inverse' })
 *   // [20, 21.95, 24.32, 27.27, 31.03, 36.00, 42.86, 52.94, 69.23, 100]
 */
export function planTemperatureSteps(input: {
  minK: number;
  maxK: number;
  count: number;
  spacing: StepSpacing;
}): number[] {
  const fn = 'planTemperatureSteps';
  const o = requireObject(fn, 'input', input);
  const minK = requirePositive(fn, 'minK', o['minK']);
  const maxK = requirePositive(fn, 'maxK', o['maxK']);
  if (minK >= maxK) {
    throw new PhysicsInputError(fn, 'minK', `requires minK below maxK, got ${minK} and ${maxK}`);
  }
  const count = requireFiniteNumber(fn, 'count', o['count']);
  if (!Number.isInteger(count) || count < 2 || count > MAX_PLAN_STEPS) {
    throw new PhysicsInputError(
      fn,
      'count',
      `requires count to be a whole number from 2 to ${MAX_PLAN_STEPS}, got ${count}`,
    );
  }
  const spacing = requireOneOf(fn, 'spacing', o['spacing'], SPACINGS);
  const steps: number[] = [];
  for (let i = 0; i < count; i++) {
    const f = i / (count - 1);
    steps.push(
      spacing === 'linear' ? minK + (maxK - minK) * f : 1 / (1 / minK - (1 / minK - 1 / maxK) * f),
    );
  }
  steps[0] = minK;
  steps[count - 1] = maxK;
  return steps;
}

/**
 * The steps with extra ones around each boundary temperature inside (minK, maxK): at the
 * boundary times each of `PLAN_DEFAULTS.denseFactors` (0.9, 0.95, 1.05, 1.1), skipping any
 * within `PLAN_DEFAULTS.mergeFraction` (1 %) of a step already there. Rising order.
 * Source: common practice, no source (the transitions are where the model's assumptions change).
 *
 * @param stepsK planned temperatures, K
 * @param boundariesK boundary temperatures, K (null entries are ignored)
 * @example denseAround([100, 200, 300], [150]) // [100, 135, 142.5, 157.5, 165, 200, 300]
 */
export function denseAround(
  stepsK: readonly number[],
  boundariesK: readonly (number | null)[],
): number[] {
  const fn = 'denseAround';
  const steps = requireArray(fn, 'stepsK', stepsK, 2).map((t) => requirePositive(fn, 'stepsK', t));
  const lo = Math.min(...steps);
  const hi = Math.max(...steps);
  const all = [...steps];
  for (const b of requireArray(fn, 'boundariesK', boundariesK)) {
    if (b === null) continue;
    const boundary = requirePositive(fn, 'boundariesK', b);
    for (const factor of PLAN_DEFAULTS.denseFactors) {
      const t = boundary * factor;
      const near = all.some((s) => Math.abs(s - t) <= PLAN_DEFAULTS.mergeFraction * t);
      if (t > lo && t < hi && !near) all.push(t);
    }
  }
  return all.sort((a, b) => a - b);
}

/**
 * Time a planned sweep takes: a ramp from room temperature to the first step, the ramps
 * between steps, a dwell at every step, and the ramp back to room temperature.
 *
 * Formula: duration = n dwellS + 60 (|T_1 - T_room| + sum |T_i+1 - T_i| + |T_n - T_room|) /
 * rampKPerMin. Assumptions: a constant ramp rate both ways, no time to cool or fill a cryostat
 * before the sweep. Source: definitions (common practice, no source).
 *
 * @param stepsK temperatures in the order visited, K
 * @param options dwellS (s, >= 0) and rampKPerMin (K/min, > 0); defaults in `PLAN_DEFAULTS`
 * @returns duration, s
 * @example sweepDurationS([296.15, 306.15], { dwellS: 60, rampKPerMin: 5 }) // 360
 */
export function sweepDurationS(
  stepsK: readonly number[],
  options: { dwellS?: number; rampKPerMin?: number } = {},
): number {
  const fn = 'sweepDurationS';
  const steps = requireArray(fn, 'stepsK', stepsK, 1).map((t) => requirePositive(fn, 'stepsK', t));
  const o = requireObject(fn, 'options', options);
  const dwellS = requireNonNegative(fn, 'dwellS', o['dwellS'] ?? PLAN_DEFAULTS.dwellS);
  const ramp = requirePositive(fn, 'rampKPerMin', o['rampKPerMin'] ?? PLAN_DEFAULTS.rampKPerMin);
  const room = PLAN_DEFAULTS.roomTemperatureK;
  let travelK = Math.abs(steps[0]! - room) + Math.abs(steps[steps.length - 1]! - room);
  for (let i = 1; i < steps.length; i++) travelK += Math.abs(steps[i]! - steps[i - 1]!);
  return steps.length * dwellS + (60 * travelK) / ramp;
}
