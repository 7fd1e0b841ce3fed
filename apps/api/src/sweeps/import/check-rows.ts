/**
 * Stages 3 to 6 over a whole file, for the preview and the store alike: each slice's rows read,
 * paired, converted, flagged and checked against the station's range. The store writes each
 * slice's points as they come; the preview only counts them. Both see the same problems and
 * warnings, so a file the preview passes is one the store takes.
 */
import type { RowProblem, SweepMapInfo, SweepMethod } from '@rhotrace/api-types';
import type { OpenedSweepFile } from '../parse';
import { RowConverter } from './convert-rows';
import { SuspiciousPointFinder, type FlagSummary } from './flag';
import { HallSummary } from './hall-summary';
import { listRows, type ConvertedPoint } from './import-types';
import type { ImportPlan } from './plan-import';
import { slices } from './read-table';
import { StationRangeCheck } from './station-range';

/** The rows of one file as points, a slice at a time. */
export class SweepRows {
  private readonly converter: RowConverter;
  private readonly finder = new SuspiciousPointFinder();
  private readonly range: StationRangeCheck;
  /** The Hall sweep's whole-sweep checks (null for other methods). */
  private readonly hall: HallSummary | null;

  constructor(
    private readonly file: OpenedSweepFile,
    plan: ImportPlan,
    method: SweepMethod,
    private readonly sliceRows: number,
  ) {
    const { columns, geometry, settings, placer, temperature } = plan;
    this.converter = new RowConverter(
      file.parsed,
      columns,
      method,
      geometry,
      settings,
      placer,
      temperature,
    );
    this.range = new StationRangeCheck(plan.station);
    const reversals = columns.some((c) => c.meaning === 'hall-voltage-pp');
    this.hall = method === 'hall' ? new HallSummary(settings, reversals) : null;
  }

  /**
   * Each slice's points, flagged, then those still held after the last. No slice is read once
   * as many problems are held as an answer lists; a row of the wrong width throws the 422.
   */
  *points(): Generator<ConvertedPoint[]> {
    const c = this.converter;
    for (const slice of slices(this.file, this.sliceRows, () => c.open)) {
      yield this.checked(c.next(slice));
    }
    yield this.checked(c.finish());
  }

  /**
   * Writes the leg on the points (all given out so far, in order) from position `from` on whose
   * leg is settled; returns how many leading points have theirs. Late flags come with `finish`.
   */
  settleLegs(points: ConvertedPoint[], from: number): number {
    return this.finder.markSettledLegs(points, from);
  }

  /** Row problems found (after `points` ran): any one of them refuses the whole file. */
  get problems(): RowProblem[] {
    return this.converter.problems;
  }

  /** After the last point: the flag summary, with every warning of the conversion in it. */
  finish(): FlagSummary {
    const flags = this.finder.finish();
    const outside = this.range.warning();
    flags.warnings = [
      ...this.converter.warnings,
      ...flags.warnings,
      ...(this.hall?.warnings ?? []),
      ...this.mapWarnings(),
      ...(outside === null ? [] : [outside]),
    ];
    return flags;
  }

  /** The Hall sweep's part of the parse report (after `finish`), or null for other methods. */
  get hallReport(): HallSummary['report'] | null {
    return this.hall ? this.hall.report : null;
  }

  /** A map's placement settings (diameter, edge exclusion, pattern), or null for a sweep. */
  get mapInfo(): SweepMapInfo | null {
    return this.converter.placer?.info ?? null;
  }

  /** What the map stage noticed without refusing it. */
  private mapWarnings(): string[] {
    const rows = this.converter.placer?.tipOffWafer ?? [];
    if (!rows.length) return [];
    return [
      `${rows.length} site(s) lie so near the edge that the probe's outer tip is off the wafer; ` +
        `they are kept but excluded, with the edge factor of a tip on the edge (rows ${listRows(rows)})`,
    ];
  }

  private checked(points: ConvertedPoint[]): ConvertedPoint[] {
    const watched = this.hall ? this.hall.addAll(points) : points;
    return this.range.addAll(this.finder.addAll(watched));
  }
}
