/**
 * Stage 5b, place a map reading: its site in mm from the wafer centre (from coordinates, or
 * from a site number of a named pattern), refused when it lies outside the wafer, flagged
 * `edge-exclusion` when it lies closer to the edge than the upload's edge exclusion, and its
 * edge factor for a collinear probe.
 *
 * The site is where the probe's centre touched down; the probe line is taken to point at the
 * edge (radially), so the nearest probe tip lies 1.5 spacings nearer the edge than the site.
 */
import {
  DEFAULT_EDGE_EXCLUSION_MM,
  type MapCorrection,
  type RowProblem,
  type SweepGeometry,
  type SweepMapInfo,
  type SweepMapInput,
  type SweepMethod,
  type SweepSite,
} from '@rhotrace/api-types';
import {
  dualConfiguration,
  edgeCorrectionFactor,
  finiteThicknessFactor,
  patternSiteMm,
  SITE_PATTERN_IDS,
  SITE_PATTERNS,
  THIN_SHEET_FACTOR,
  type SitePatternId,
} from '@rhotrace/physics';
import { validationFailed } from '../../errors';
import { rowProblem, type ResolvedColumn } from '../parse';
import type { Reading } from './import-types';
import { currentOf, voltageOf, type PointInput, type PointValues } from './methods/point-method';

/** A reading's place on the wafer. */
export interface SitePlacement {
  site: SweepSite;
  excluded: boolean;
  /** The edge factor of the reading (1 where no correction applies). */
  edgeFactor: number;
}

/** Sites this close outside the edge (mm) count as on it: coordinates rounded in the file. */
const EDGE_ROUNDING_MM = 1e-6;

/** True when the columns place readings at sites (the upload becomes a map). */
export function hasSites(columns: ResolvedColumn[]): boolean {
  return columns.some((c) => c.meaning === 'site-x' || c.meaning === 'site');
}

/** Which edge correction a map of this method and columns gets. */
export function mapCorrection(method: SweepMethod, columns: ResolvedColumn[]): MapCorrection {
  if (method !== 'four-point') return 'none';
  return columns.some((c) => c.meaning === 'resistance-b') ? 'dual-configuration' : 'edge-images';
}

/**
 * Places the readings of one map upload. Throws a 400 naming the field when the map cannot be
 * placed at all (no wafer diameter, an unknown pattern, an edge exclusion out of range).
 */
export class SitePlacer {
  readonly info: SweepMapInfo;
  private readonly radiusMm: number;
  private readonly pattern: SitePatternId | null;
  private readonly siteColumn: string | null;
  private readonly spacingMm: number | null;
  /** Sites whose outer probe tip would lie off the wafer (row numbers). */
  readonly tipOffWafer: number[] = [];

  constructor(
    input: SweepMapInput,
    method: SweepMethod,
    columns: ResolvedColumn[],
    geometry: SweepGeometry,
    private readonly problems: RowProblem[],
  ) {
    const fieldProblems: Array<{ field: string; problem: string }> = [];
    const edgeExclusionMm = input.edgeExclusionMm ?? DEFAULT_EDGE_EXCLUSION_MM;
    const diameterMm = (geometry.diameterCm ?? 0) * 10;
    this.radiusMm = diameterMm / 2;
    if (!(diameterMm > 0)) {
      fieldProblems.push({
        field: 'diameterCm',
        problem: 'a wafer map needs the wafer diameter: give diameterCm, or record it on the lot',
      });
    } else if (edgeExclusionMm >= this.radiusMm) {
      fieldProblems.push({
        field: 'edgeExclusionMm',
        problem: `must be less than the wafer radius (${this.radiusMm} mm)`,
      });
    }
    const x = columns.find((c) => c.meaning === 'site-x');
    const number = columns.find((c) => c.meaning === 'site');
    this.siteColumn = (x ?? number)?.header ?? null;
    this.pattern = null;
    if (!x && number) {
      const id = input.sitePattern;
      if (id === undefined) {
        fieldProblems.push({
          field: 'sitePattern',
          problem: `the file numbers its sites: name their pattern (${SITE_PATTERN_IDS.join(', ')})`,
        });
      } else if ((SITE_PATTERN_IDS as readonly string[]).includes(id)) {
        this.pattern = id as SitePatternId;
      } else {
        fieldProblems.push({
          field: 'sitePattern',
          problem: `must be one of ${SITE_PATTERN_IDS.join(', ')}`,
        });
      }
    }
    if (fieldProblems.length) throw validationFailed('The map cannot be placed', fieldProblems);
    const correction = mapCorrection(method, columns);
    this.spacingMm =
      correction === 'edge-images' && geometry.spacingCm ? geometry.spacingCm * 10 : null;
    this.info = {
      diameterMm,
      edgeExclusionMm,
      pattern: this.pattern,
      correction,
      probeSpacingMm:
        method === 'four-point' && geometry.spacingCm ? geometry.spacingCm * 10 : null,
    };
  }

  /** The reading's placement, or null after noting a problem (a site outside the wafer). */
  place(reading: Reading): SitePlacement | null {
    const raw = reading.site;
    if (!raw) {
      this.problems.push(rowProblem(reading.row, this.siteColumn, 'the site is missing'));
      return null;
    }
    let site: SweepSite;
    if (raw.kind === 'xy') {
      site = { xMm: raw.xMm, yMm: raw.yMm, label: raw.label };
    } else {
      const sites = patternSize(this.pattern!);
      if (raw.number > sites) {
        this.problems.push(
          rowProblem(
            reading.row,
            this.siteColumn,
            `site ${raw.number} is not in pattern ${this.pattern} (sites 1 to ${sites})`,
          ),
        );
        return null;
      }
      const p = patternSiteMm(this.pattern!, raw.number, this.radiusMm - this.info.edgeExclusionMm);
      site = { xMm: p.xMm, yMm: p.yMm, label: raw.label ?? p.label };
    }
    const fromEdgeMm = this.radiusMm - Math.hypot(site.xMm, site.yMm);
    if (fromEdgeMm < -EDGE_ROUNDING_MM) {
      this.problems.push(
        rowProblem(
          reading.row,
          this.siteColumn,
          `the site (${round(site.xMm)}, ${round(site.yMm)}) mm lies ${round(-fromEdgeMm)} mm outside the wafer (radius ${this.radiusMm} mm)`,
        ),
      );
      return null;
    }
    let excluded = fromEdgeMm < this.info.edgeExclusionMm;
    let edgeFactor = 1;
    if (this.spacingMm !== null) {
      const tipMm = fromEdgeMm - 1.5 * this.spacingMm;
      if (tipMm < 0) {
        // The outer tip is off the wafer: the image method no longer describes the reading.
        // The point is kept, excluded, with the factor of a tip on the edge as a bound.
        this.tipOffWafer.push(reading.row);
        excluded = true;
      }
      edgeFactor = edgeCorrectionFactor({
        distanceCm: Math.max(0, tipMm) / 10,
        spacingCm: this.spacingMm / 10,
      });
    }
    return { site, excluded, edgeFactor };
  }
}

function patternSize(id: SitePatternId): number {
  return SITE_PATTERNS[id].length;
}

/**
 * The converter of a dual-configuration map: R_a is the reading's V/I (or its resistance
 * column), R_b its `resistance-b` column; R_s by the dual-configuration relation, resistivity
 * R_s t F(t/s) with the finite-thickness factor of the single configuration (1 for a thin
 * layer, where the relation holds). The edge factor it reports is the single-configuration
 * R_s over the dual one: how much the edge raised the reading.
 */
export function dualConfigurationConverter(
  geometry: SweepGeometry,
): (input: PointInput) => PointValues & { edgeFactor: number } {
  const thicknessCm = geometry.thicknessCm!;
  const thicknessFactor = finiteThicknessFactor(thicknessCm / geometry.spacingCm!);
  return (input) => {
    const resistanceAOhm = voltageOf(input) / currentOf(input);
    const out = dualConfiguration({ resistanceAOhm, resistanceBOhm: input.resistanceBOhm! });
    return {
      sheetResistanceOhmSq: out.sheetResistanceOhmSq,
      resistivityOhmCm: out.sheetResistanceOhmSq * thicknessCm * thicknessFactor,
      edgeFactor: (THIN_SHEET_FACTOR * resistanceAOhm) / out.sheetResistanceOhmSq,
    };
  };
}

function round(mm: number): number {
  return Math.round(mm * 1000) / 1000;
}
