/**
 * Stages 3 to 5 for one slice of records: read each row, pair polarities, turn groups into
 * points. Row problems are collected (at most `MAX_PROBLEMS`) across all slices; once there is
 * one, no more points are given out and the caller must store nothing.
 */
import type { RowProblem, SweepGeometry, SweepMethod } from '@rhotrace/api-types';
import { MAX_PROBLEMS, rowProblem, type ParsedSweepFile, type ResolvedColumn } from '../parse';
import type { ConvertedPoint, Reading } from './import-types';
import { PolarityPairer, type ReadingGroup } from './pair-polarities';
import { RowReader } from './read-row';
import type { Slice } from './read-table';
import type { SitePlacer } from './sites';
import type { MethodSettings } from './methods';
import type { TemperatureReader } from './temperature';
import { pointMaker } from './to-point';

/** Converts a file's records to points a slice at a time. */
export class RowConverter {
  /** Row problems found so far (at most `MAX_PROBLEMS`). */
  readonly problems: RowProblem[];
  private readonly rows: RowReader;
  private readonly pairer = new PolarityPairer();
  private readonly toPoint: (group: ReadingGroup) => ConvertedPoint | null;
  private emitted = 0;
  /** Places map readings on the wafer (null for a sweep without sites). */
  readonly placer: SitePlacer | null;

  constructor(
    parsed: ParsedSweepFile,
    columns: ResolvedColumn[],
    method: SweepMethod,
    geometry: SweepGeometry,
    settings?: MethodSettings,
    placer: ((problems: RowProblem[]) => SitePlacer) | null = null,
    temperature?: TemperatureReader,
  ) {
    this.problems = [...parsed.problems];
    const currentA = parsed.recognised.currentA;
    this.rows = new RowReader(
      parsed,
      columns,
      method,
      geometry,
      currentA,
      this.problems,
      temperature,
    );
    this.placer = placer ? placer(this.problems) : null;
    this.toPoint = pointMaker(method, geometry, columns, this.problems, settings, this.placer);
  }

  /** True while more problems may still be collected. */
  get open(): boolean {
    return this.problems.length < MAX_PROBLEMS;
  }

  /** The points the slice completes (a reading with a polarity may wait for the next slice). */
  next(slice: Slice): ConvertedPoint[] {
    const readings: Reading[] = [];
    for (let i = slice.start; i < slice.end && this.open; i++) {
      const reading = this.rows.read(i);
      if (reading) readings.push(reading);
    }
    if (this.problems.length) return [];
    return this.pointsOf(this.pairer.pair(readings, slice.more));
  }

  /** The points still held after the last slice, and the final check for an empty file. */
  finish(): ConvertedPoint[] {
    const rest = this.problems.length ? [] : this.pointsOf(this.pairer.finish());
    if (this.problems.length === 0 && this.emitted === 0) {
      this.problems.push(rowProblem(null, null, 'the file holds no data rows'));
    }
    return rest;
  }

  /** The warnings about the conversion itself (polarity readings left unpaired). */
  get warnings(): string[] {
    return this.pairer.warnings;
  }

  private pointsOf(groups: ReadingGroup[]): ConvertedPoint[] {
    const points: ConvertedPoint[] = [];
    for (let i = 0; i < groups.length && this.open; i++) {
      const point = this.toPoint(groups[i]!);
      if (point) points.push(point);
    }
    if (this.problems.length) return [];
    this.emitted += points.length;
    return points;
  }
}
