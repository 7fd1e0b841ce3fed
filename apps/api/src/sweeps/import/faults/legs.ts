/**
 * Ramp legs: a sweep that ramps up and back down (or down and up) is split where its temperature
 * turns, so each leg is read on its own and its return is not taken for a reversal.
 */
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';

/** A leg changes only after a move of more than this many step tolerances against it. */
export const LEG_CHANGE_FACTOR = 3;

/** ... sustained over at least this many consecutive points (one thermometer spike is not). */
export const LEG_SUSTAINED_POINTS = 3;

/** Which way a leg runs; `hold` when the whole sweep stays within the threshold. */
export type LegDirection = 'up' | 'down' | 'hold';

/** A leg as positions in stored order: `start` inclusive, `end` exclusive. */
export interface LegRange {
  start: number;
  end: number;
  direction: LegDirection;
}

/**
 * Splits temperatures (in stored order) into legs. The first leg takes the direction of the
 * first move beyond `LEG_CHANGE_FACTOR` x `toleranceK` from the start. A leg running up ends at
 * its highest point (the last reading still within `toleranceK` of it, so a dwell at the top
 * stays with the ramp) once the temperature has fallen more than the threshold below that
 * highest point for `LEG_SUSTAINED_POINTS` readings in a row; the same mirrored for a leg
 * running down. Common practice, no source: a turn must outlast thermometer noise and a single
 * spike, as an engineer reading the trace would judge it.
 */
export function splitLegs(
  temperaturesK: ArrayLike<number>,
  toleranceK: number = PHYSICS_DEFAULTS.fitStepToleranceK,
): LegRange[] {
  const n = temperaturesK.length;
  if (n === 0) return [];
  const threshold = LEG_CHANGE_FACTOR * toleranceK;
  const t = (i: number) => temperaturesK[i]!;
  const legs: LegRange[] = [];
  let start = 0;
  let direction: 1 | -1 | 0 = 0;
  for (let i = 1; i < n && direction === 0; i++) {
    if (Math.abs(t(i) - t(0)) > threshold) direction = t(i) > t(0) ? 1 : -1;
  }
  if (direction === 0) return [{ start: 0, end: n, direction: 'hold' }];
  let extreme = start;
  let against = 0;
  for (let i = start + 1; i < n; i++) {
    if ((t(i) - t(extreme)) * direction > 0) extreme = i;
    if ((t(extreme) - t(i)) * direction > threshold) against++;
    else against = 0;
    if (against < LEG_SUSTAINED_POINTS) continue;
    // the turn: the last reading still within the step tolerance of the extreme
    let turn = extreme;
    while (turn + 1 < i && Math.abs(t(turn + 1) - t(extreme)) <= toleranceK) turn++;
    legs.push({ start, end: turn + 1, direction: direction > 0 ? 'up' : 'down' });
    start = turn + 1;
    direction = direction > 0 ? -1 : 1;
    extreme = start;
    for (let j = start + 1; j <= i; j++) if ((t(j) - t(extreme)) * direction > 0) extreme = j;
    against = 0;
  }
  legs.push({ start, end: n, direction: direction > 0 ? 'up' : 'down' });
  return legs;
}

/**
 * Dwell steps in positions [start, end): consecutive readings within `toleranceK` of a step's
 * first reading form one step (the grouping of `dwellSteps` in the physics library). Returns
 * each step as [start, end).
 */
export function stepRanges(
  temperaturesK: ArrayLike<number>,
  start: number,
  end: number,
  toleranceK: number = PHYSICS_DEFAULTS.fitStepToleranceK,
): Array<[number, number]> {
  const steps: Array<[number, number]> = [];
  let i = start;
  while (i < end) {
    const first = temperaturesK[i]!;
    let j = i + 1;
    while (j < end && Math.abs(temperaturesK[j]! - first) <= toleranceK) j++;
    steps.push([i, j]);
    i = j;
  }
  return steps;
}
