/**
 * Wafer maps: a sweep whose points carry sites, its maps at each temperature, and a lot's maps
 * side by side.
 */

/**
 * How a map's four-point readings were corrected for the wafer edge:
 * - `edge-images`: the method of images for a probe line pointing at the edge (radially);
 * - `dual-configuration`: the dual-configuration relation (the file carries both
 *   configurations), which needs no edge distance;
 * - `none`: the method reads no collinear probe (resistivity or sheet resistance given, van der
 *   Pauw or bar), so no edge factor applies.
 */
export const MAP_CORRECTIONS = ['edge-images', 'dual-configuration', 'none'] as const;
export type MapCorrection = (typeof MAP_CORRECTIONS)[number];

/** Default edge exclusion of a map upload, mm. */
export const DEFAULT_EDGE_EXCLUSION_MM = 3;

/** The map fields of an upload (besides the file and geometry). */
export interface SweepMapInput {
  /** The pattern a `site` column numbers (one of the physics library's `SITE_PATTERN_IDS`). */
  sitePattern?: string;
  /** Sites closer to the edge than this are stored and flagged `edge-exclusion`; default 3. */
  edgeExclusionMm?: number;
}

/** What a map sweep records about its wafer and conversion. */
export interface SweepMapInfo {
  diameterMm: number;
  edgeExclusionMm: number;
  /** The pattern the file numbered its sites by, or null for coordinates. */
  pattern: string | null;
  correction: MapCorrection;
  /** Probe spacing the edge factor used, mm (null without a collinear probe). */
  probeSpacingMm: number | null;
}

/** One site of a map at one temperature (its readings there averaged). */
export interface MapSiteDto {
  xMm: number;
  yMm: number;
  label: string | null;
  sheetResistanceOhmSq: number | null;
  resistivityOhmCm: number;
  /** The edge factor the readings were divided by (1 far from the edge; see `correction`). */
  edgeFactor: number;
  /** True inside the edge exclusion: shown, not counted in the statistics. */
  excluded: boolean;
  /** Readings averaged into this site's value. */
  readingCount: number;
}

/**
 * Uniformity over the sites not excluded: mean, sample standard deviation (n - 1) and in per
 * cent of the mean, extremes, range (max - min) / (max + min) * 100, and the least-squares
 * slope against radius in per cent of the mean per mm. Null spreads: one site; null slope:
 * all sites at one radius.
 */
export interface MapStatisticsDto {
  count: number;
  meanOhmCm: number;
  stdDevOhmCm: number | null;
  stdDevPercent: number | null;
  minOhmCm: number;
  maxOhmCm: number;
  rangePercent: number;
  radialSlopePercentPerMm: number | null;
}

/** The map at one temperature step; statistics null when every site is excluded. */
export interface MapAtTemperatureDto {
  temperatureK: number;
  sites: MapSiteDto[];
  statistics: MapStatisticsDto | null;
}

/** A numbered site of a pattern, placed on this wafer. */
export interface PatternSiteDto {
  number: number;
  label: string;
  xMm: number;
  yMm: number;
}

/** `GET /api/sweeps/:id/map`. */
export interface SweepMapResponse {
  sweepId: number;
  waferId: number;
  map: SweepMapInfo;
  /** Flat for wafers under 200 mm, notch from 200 mm (common practice), at -y. */
  outline: 'flat' | 'notch';
  pattern: { id: string; sites: PatternSiteDto[] } | null;
  temperaturesK: number[];
  maps: MapAtTemperatureDto[];
}

/** One wafer's map in a lot's side-by-side view. */
export interface LotWaferMapDto {
  waferId: number;
  waferNumber: string;
  sweepId: number;
  map: SweepMapInfo;
  outline: 'flat' | 'notch';
  /** The wafer's map at the temperature nearest 23 °C. */
  atTemperature: MapAtTemperatureDto;
}

/** `GET /api/lots/:id/maps`: each wafer's newest map, on one colour scale. */
export interface LotMapsResponse {
  lotId: number;
  /** The common colour scale: lowest and highest site resistivity over all wafers shown. */
  scale: { minOhmCm: number; maxOhmCm: number } | null;
  wafers: LotWaferMapDto[];
}

/** A map wafer's uniformity at the step nearest 23 °C. */
export interface WaferUniformity {
  temperatureK: number;
  siteCount: number;
  /** Sample standard deviation over the sites in per cent of their mean; null for one site. */
  stdDevPercent: number | null;
  /** (max - min) / (max + min) * 100. */
  rangePercent: number;
}

/** The spread of the map wafers' uniformities across a lot. */
export interface LotUniformitySpread {
  /** Map wafers with a standard deviation (two sites or more). */
  count: number;
  meanStdDevPercent: number;
  minStdDevPercent: number;
  maxStdDevPercent: number;
  /** Sample standard deviation of the wafers' stdDevPercent; null for one wafer. */
  stdDevOfStdDevPercent: number | null;
}
