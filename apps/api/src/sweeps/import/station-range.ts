/**
 * Stage 6b, station range: points outside the temperature range the chosen station's chuck
 * spans are not refused (historic files and re-registered stations exist) but named in a
 * warning the preview shows before storing and the parse report keeps.
 */
import type { Station } from '../../stations/station.model';
import { listRows, type ConvertedPoint } from './import-types';

/** The station facts the check needs. */
export type StationRange = Pick<Station, 'name' | 'minTemperatureK' | 'maxTemperatureK'>;

/** Rounds a temperature for a sentence (0.1 K is finer than any chuck's range). */
const kelvin = (k: number) => `${Math.round(k * 10) / 10} K`;

/** Counts the points outside the station's range as they come. */
export class StationRangeCheck {
  private readonly rows: number[] = [];
  private lowestK = Infinity;
  private highestK = -Infinity;

  constructor(private readonly station: StationRange | null) {}

  /** Takes the next points; returns them unchanged. */
  addAll(points: ConvertedPoint[]): ConvertedPoint[] {
    const s = this.station;
    if (!s) return points;
    for (const p of points) {
      const t = p.temperatureK;
      if (t >= s.minTemperatureK && t <= s.maxTemperatureK) continue;
      this.rows.push(p.sourceRows[0]!);
      if (t < this.lowestK) this.lowestK = t;
      if (t > this.highestK) this.highestK = t;
    }
    return points;
  }

  /** The warning after the last point, or null when every point lies within the range. */
  warning(): string | null {
    const s = this.station;
    if (!s || this.rows.length === 0) return null;
    const span = `${kelvin(s.minTemperatureK)} to ${kelvin(s.maxTemperatureK)}`;
    const seen =
      this.lowestK === this.highestK
        ? kelvin(this.lowestK)
        : `${kelvin(this.lowestK)} to ${kelvin(this.highestK)}`;
    return (
      `${this.rows.length} point(s) at ${seen} lie outside the ${span} that station ` +
      `"${s.name}" spans (row${this.rows.length === 1 ? '' : 's'} ${listRows(this.rows)}): ` +
      'check that the right station is chosen'
    );
  }
}
