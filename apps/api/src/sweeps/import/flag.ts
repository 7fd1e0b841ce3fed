/**
 * Stage 6, flag: marks suspicious points without refusing them (a resistivity jump between
 * neighbours, a temperature going against the ramp) and finds the sweep's temperature range.
 */
import { JUMP_FACTOR } from '@rhotrace/api-types';
import { listRows, type ConvertedPoint } from './import-types';

/** A step against the ramp direction larger than this is a reversal (thermometer noise is less). */
export const REVERSAL_TOLERANCE_K = 0.5;

/** What the flag stage found over the whole sweep. */
export interface FlagSummary {
  /** Positions (0-based, in stored order) of the points that go against the ramp. */
  reversals: number[];
  /** Points carrying a jump or reversal flag. */
  flagged: number;
  warnings: string[];
  minTemperatureK: number | null;
  maxTemperatureK: number | null;
}

/**
 * Finds suspicious points as they come, for an import that stores them slice by slice: a jump
 * is flagged on the point itself as it is added (it needs only the previous point); a reversal
 * needs the ramp direction, from the first to the last point, so `finish` names those.
 */
export class SuspiciousPointFinder {
  private previous: ConvertedPoint | null = null;
  private readonly temperatures: number[] = [];
  private readonly rows: number[] = [];
  private readonly jumps: number[] = [];

  /** Takes the next points, adding their `jump` flags in place; returns them. */
  addAll(points: ConvertedPoint[]): ConvertedPoint[] {
    for (const point of points) this.add(point);
    return points;
  }

  /** Takes the next point, adding its `jump` flag in place. */
  add(point: ConvertedPoint): void {
    const prev = this.previous;
    if (prev) {
      const ratio = point.resistivityOhmCm / prev.resistivityOhmCm;
      if (ratio > JUMP_FACTOR || ratio < 1 / JUMP_FACTOR) {
        point.flags.push('jump');
        this.jumps.push(this.rows.length);
      }
    }
    this.previous = point;
    this.temperatures.push(point.temperatureK);
    this.rows.push(point.sourceRows[0]!);
  }

  /**
   * After the last point: the positions (0-based, in the order added) of the points that go
   * against the ramp, how many points carry either flag, one warning per kind, and the lowest
   * and highest temperature (null without points).
   */
  finish(): FlagSummary {
    const t = this.temperatures;
    const reversals: number[] = [];
    const direction = t.length < 2 ? 0 : Math.sign(t[t.length - 1]! - t[0]!);
    if (direction !== 0) {
      for (let i = 1; i < t.length; i++) {
        if ((t[i]! - t[i - 1]!) * direction < -REVERSAL_TOLERANCE_K) reversals.push(i);
      }
    }
    const warnings: string[] = [];
    if (this.jumps.length) {
      warnings.push(
        `${this.jumps.length} point(s) differ from the previous one by more than ${JUMP_FACTOR} times in resistivity (rows ${listRows(this.jumps.map((i) => this.rows[i]!))})`,
      );
    }
    if (reversals.length) {
      warnings.push(
        `the temperature goes against the ramp at ${reversals.length} point(s) (rows ${listRows(reversals.map((i) => this.rows[i]!))})`,
      );
    }
    const flagged = new Set([...this.jumps, ...reversals]).size;
    let minTemperatureK = t.length ? Infinity : null;
    let maxTemperatureK = t.length ? -Infinity : null;
    for (const k of t) {
      if (k < minTemperatureK!) minTemperatureK = k;
      if (k > maxTemperatureK!) maxTemperatureK = k;
    }
    return { reversals, flagged, warnings, minTemperatureK, maxTemperatureK };
  }
}
