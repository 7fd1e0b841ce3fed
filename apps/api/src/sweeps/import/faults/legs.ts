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
  const splitter = new LegSplitter(toleranceK);
  for (let i = 0; i < temperaturesK.length; i++) splitter.add(temperaturesK[i]!);
  return splitter.finish();
}

/**
 * `splitLegs` one temperature at a time, telling as it goes how many leading positions already
 * have their leg settled (`settled`), so they can be stored before the sweep ends.
 */
export class LegSplitter {
  private readonly t: number[] = [];
  private readonly threshold: number;
  /** Legs ended so far. */
  readonly legs: LegRange[] = [];
  private start = 0;
  /** 0 until the first move beyond the threshold gives the first leg its direction. */
  private direction: 1 | -1 | 0 = 0;
  private extreme = 0;
  private against = 0;

  constructor(private readonly toleranceK: number = PHYSICS_DEFAULTS.fitStepToleranceK) {
    this.threshold = LEG_CHANGE_FACTOR * toleranceK;
  }

  /** Takes the next temperature. */
  add(temperatureK: number): void {
    const t = this.t;
    t.push(temperatureK);
    const i = t.length - 1;
    if (this.direction !== 0) {
      this.step(i);
    } else if (i > 0 && Math.abs(temperatureK - t[0]!) > this.threshold) {
      // the direction is known: the positions read so far are walked again with it
      this.direction = temperatureK > t[0]! ? 1 : -1;
      for (let j = 1; j <= i; j++) this.step(j);
    }
  }

  /**
   * Leading positions whose leg can no longer change: those before the current leg's extreme
   * (the leg ends at or after it), none while the first leg has no direction.
   */
  get settled(): number {
    return this.direction === 0 ? 0 : this.extreme;
  }

  /** The leg number (1, 2, ...) of a settled position. */
  legOf(position: number): number {
    // from the last leg back: positions are mostly asked for in the current leg
    let k = this.legs.length;
    while (k > 0 && this.legs[k - 1]!.end > position) k--;
    return k + 1;
  }

  /** After the last temperature: every leg. */
  finish(): LegRange[] {
    const n = this.t.length;
    if (n === 0) return [];
    if (this.direction === 0) return [{ start: 0, end: n, direction: 'hold' }];
    return [
      ...this.legs,
      { start: this.start, end: n, direction: this.direction > 0 ? 'up' : 'down' },
    ];
  }

  private step(i: number): void {
    const t = this.t;
    const tol = this.toleranceK;
    const direction = this.direction;
    if ((t[i]! - t[this.extreme]!) * direction > 0) this.extreme = i;
    if ((t[this.extreme]! - t[i]!) * direction > this.threshold) this.against++;
    else this.against = 0;
    if (this.against < LEG_SUSTAINED_POINTS) return;
    // the turn: the last reading still within the step tolerance of the extreme
    const extreme = this.extreme;
    let turn = extreme;
    while (turn + 1 < i && Math.abs(t[turn + 1]! - t[extreme]!) <= tol) turn++;
    this.legs.push({ start: this.start, end: turn + 1, direction: direction > 0 ? 'up' : 'down' });
    this.start = turn + 1;
    this.direction = direction > 0 ? -1 : 1;
    this.extreme = this.start;
    for (let j = this.start + 1; j <= i; j++) {
      if ((t[j]! - t[this.extreme]!) * this.direction > 0) this.extreme = j;
    }
    this.against = 0;
  }
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
