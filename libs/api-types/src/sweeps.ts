import type { SweepMapInfo } from './maps';
import type { StationUploadDto } from './station-tokens';

/** How a sweep's readings become resistivity. */
export const SWEEP_METHODS = [
  'four-point',
  'van-der-pauw',
  'bar',
  'resistivity',
  'sheet-resistance',
  'hall',
] as const;
export type SweepMethod = (typeof SWEEP_METHODS)[number];

/** Each measurement method in words, as the screens and the printed reports name it. */
export const METHOD_WORDS: Readonly<Record<SweepMethod, string>> = {
  'four-point': 'Four-point probe (collinear)',
  'van-der-pauw': 'Van der Pauw square',
  bar: 'Bar with contacts',
  resistivity: 'Resistivity already computed',
  'sheet-resistance': 'Sheet resistance already computed',
  hall: 'Hall effect (van der Pauw with a field)',
};

/**
 * What a column of an imported file holds. `resistance` is V/I (for van der Pauw: R_A) and
 * `resistance-b` the second van der Pauw configuration (R_B; on a four-point map, the second
 * configuration of a dual-configuration reading); `other` is kept raw only. A map file places
 * each reading at a site: `site-x` and `site-y` in mm from the wafer centre, or `site`, a site
 * number of the pattern named in the upload (`sitePattern`); `site-label` names the site.
 * `resistance-b` the second van der Pauw configuration (R_B); `other` is kept raw only.
 * Hall sweeps add `magnetic-field` and either `hall-voltage` (already corrected for offsets) or
 * the four reversals `hall-voltage-xy` (x the field sign, y the current sign; p = +, n = -).
 * Van der Pauw files may add the reciprocal readings, current and voltage contacts swapped:
 * `resistance-reciprocal` (R_CD,AB against R_A = R_AB,CD) and `resistance-b-reciprocal`
 * (R_DA,BC against R_B = R_BC,DA); the point takes each pair's mean and a pair more than 2 %
 * apart flags `contact-fault`.
 */
export const COLUMN_MEANINGS = [
  'temperature',
  'voltage',
  'current',
  'resistance',
  'resistance-b',
  'sheet-resistance',
  'resistivity',
  'polarity',
  'current-level',
  'time',
  'index',
  'other',
  'site-x',
  'site-y',
  'site',
  'site-label',
  'magnetic-field',
  'hall-voltage',
  'hall-voltage-pp',
  'hall-voltage-pn',
  'hall-voltage-np',
  'hall-voltage-nn',
  'reference-junction',
  'resistance-reciprocal',
  'resistance-b-reciprocal',
] as const;
export type ColumnMeaning = (typeof COLUMN_MEANINGS)[number];

/**
 * Flags a stored point may carry (a point's `flags` is a list of these):
 * - `jump`: resistivity differs from the previous point by more than `JUMP_FACTOR` times;
 * - `temperature-reversal`: temperature moved against the ramp direction;
 * - `polarity-averaged`: combined from a forward and a reverse reading (`raw` holds both rows);
 * - `unpaired-polarity`: a forward or reverse reading without its partner, stored on its own;
 * - `edge-exclusion`: a map site closer to the wafer edge than the upload's edge exclusion
 *   (stored and shown, left out of the map statistics and the map mean);
 * - `outlier`: ln rho lies beyond a Hampel filter's bound within its leg;
 * - `polarity-asymmetry`: forward and reverse readings differ by more than 2 %;
 * - `self-heating`: the higher of two current levels at one step reads beyond the scatter;
 * - `unsettled`: the readings of a step still drift one way (a dwell too short);
 * - `contact-fault`: van der Pauw reciprocal configurations disagree by more than 2 %.
 * The reason for each of the last five is listed in the sweep's `parseReport.findings`.
 */
export const POINT_FLAGS = [
  'jump',
  'temperature-reversal',
  'polarity-averaged',
  'unpaired-polarity',
  'edge-exclusion',
  'outlier',
  'polarity-asymmetry',
  'self-heating',
  'unsettled',
  'contact-fault',
] as const;
export type PointFlag = (typeof POINT_FLAGS)[number];

/** Neighbouring points whose resistivity differs by more than this factor are flagged `jump`. */
export const JUMP_FACTOR = 10;

/** One detected (or user-given) column. `unit` is the canonical label, e.g. `mV`, `degC`, `ohm`. */
export interface SweepColumn {
  index: number;
  header: string;
  meaning: ColumnMeaning;
  unit: string | null;
  /** 0 to 1: how sure the detection is (1 for a mapping the user gave). */
  confidence: number;
}

/** A problem with one place of a file. `row` is the 1-based line number in the file. */
export interface RowProblem {
  row: number | null;
  column: string | null;
  problem: string;
  /** The same place in words (`row 12, column V (mV)`), for the standard error shape. */
  field: string;
}

/** A column mapping override sent with the store request (JSON text in field `columns`). */
export interface SweepColumnOverride {
  index: number;
  meaning: ColumnMeaning;
  unit?: string | null;
}

/** Geometry overrides of the store request, all in centimetres. */
export interface SweepGeometryInput {
  thicknessCm?: number;
  diameterCm?: number;
  spacingCm?: number;
  barLengthCm?: number;
  barWidthCm?: number;
}

/** Where each geometry value came from. */
export type GeometrySource = 'request' | 'wafer' | 'lot' | 'station' | 'file';

/** The geometry a sweep was converted with. */
export interface SweepGeometry extends SweepGeometryInput {
  rtdR0Ohm?: number;
  sources: Partial<Record<keyof SweepGeometryInput | 'rtdR0Ohm', GeometrySource>>;
}

/** `POST /api/wafers/:id/sweeps` → 201. */
export interface SweepCreatedResponse {
  id: number;
  pointCount: number;
  warnings: string[];
}

/** A sweep without its points (`GET /api/wafers/:id/sweeps` items). */
export interface SweepSummaryDto {
  id: number;
  waferId: number;
  stationId: number | null;
  method: SweepMethod;
  geometry: SweepGeometry;
  uploadedById: number;
  uploadedByName: string | null;
  originalName: string;
  sizeBytes: number;
  sha256: string;
  pointCount: number;
  minTemperatureK: number | null;
  maxTemperatureK: number | null;
  createdAt: string;
  /** Set when the sweep is a wafer map (its points carry sites). */
  map?: SweepMapInfo | null;
  /** Set when a probe station posted the sweep with its token. */
  uploadedVia?: StationUploadDto | null;
  /** Points carrying a doubtful flag (`parseReport.flaggedPoints`); absent on old sweeps. */
  flaggedPoints?: number;
}

/** A doubtful point and why, in words (`the step at 300.0 K drifts by +0.8 %`). */
export interface PointFinding {
  /** The point's `sequence`. */
  sequence: number;
  /** The file row it was read from. */
  row: number;
  flag: PointFlag;
  reason: string;
}

/** How the import read the temperature column. */
export interface TemperatureConversion {
  /** `kelvin`, `celsius`, `platinum-rtd`, `thermocouple` or `table`. */
  kind: 'kelvin' | 'celsius' | 'platinum-rtd' | 'thermocouple' | 'table';
  /** The conversion in words, e.g. `type K thermocouple, cold junction 23.4 °C (file metadata)`. */
  description: string;
}

/** What the import found and decided, kept with the sweep. */
export interface SweepParseReport {
  delimiter: string;
  decimalMark: string;
  headerRow: number | null;
  rowCount: number;
  warnings: string[];
  flaggedPoints: number;
  /** Hall sweeps only: the Hall factor used and what the import found. */
  hall?: HallImportReport;
  /** Each flagged point with its reason (the first `MAX_FINDINGS`); absent on old sweeps. */
  findings?: PointFinding[];
  /** How the temperatures were converted; absent on old sweeps. */
  temperature?: TemperatureConversion;
}

/** Findings kept in a parse report; the count beyond them is in `flaggedPoints`. */
export const MAX_FINDINGS = 500;

/** The file row (1-based line number) a point was read from, cell text keyed by header. */
export interface RawReading {
  row: number;
  values: Record<string, string>;
}

/**
 * One stored point. `raw` holds the file rows it was made from (two for a polarity-averaged
 * point), with each cell's text as read. `sourceRow` is the first of them.
 */
export interface SweepPointDto {
  sequence: number;
  sourceRow: number;
  temperatureK: number;
  raw: RawReading[];
  currentA: number | null;
  voltageV: number | null;
  resistanceOhm: number | null;
  sheetResistanceOhmSq: number | null;
  resistivityOhmCm: number;
  flags: PointFlag[];
  /** Where on the wafer the point was measured (map sweeps), else null or absent. */
  site?: SweepSite | null;
  /** Measured or derived quantities beyond resistivity (Hall sweeps), null when none. */
  quantities?: PointQuantities | null;
  /** The ramp leg (1, 2, ...) the point belongs to; null on sweeps imported before legs. */
  leg?: number | null;
}

/**
 * Quantities a point carries beyond the fixed columns, stored as one JSON document per point
 * (`sweep_points.quantities`). Keys are camelCase with their unit in the name; a new measured
 * quantity is a new key, not a new column.
 */
export interface PointQuantities {
  /** Signed Hall coefficient R_H, cm^3/C (negative for electrons). */
  hallCoefficientCm3PerC?: number;
  /** Hall carrier density r_H / (q |R_H|), cm^-3. */
  carrierDensityCm3?: number;
  /** Sheet carrier density, cm^-2. */
  sheetCarrierDensityCm2?: number;
  /** Hall mobility |R_H| / rho, cm^2/(V s). */
  hallMobilityCm2PerVs?: number;
  carrierType?: 'n' | 'p';
  /** Field the Hall voltage was measured at, T. */
  magneticFieldT?: number;
  /** Hall voltage at +B, +I with offsets removed, V. */
  hallVoltageV?: number;
  [key: string]: number | string | undefined;
}

/** Named Hall scattering factors the store request accepts for `hallFactor`. */
export const HALL_FACTOR_NAMES = ['acoustic-phonon', 'ionized-impurity', 'degenerate'] as const;
export type HallFactorName = (typeof HALL_FACTOR_NAMES)[number];

/** How a Hall sweep's densities were computed (in its parse report). */
export interface HallImportReport {
  /** r_H the densities were divided by (n = r_H / (q |R_H|)). */
  hallFactor: number;
  /** The named factor, or null when a number was given. */
  hallFactorName: HallFactorName | null;
  /** True when the carrier type changes sign within the sweep (mixed conduction). */
  mixedConduction: boolean;
  /** Whether the Hall voltage came from the four reversals or one corrected column. */
  hallVoltageFrom: 'reversals' | 'corrected-column';
}

/** A map point's site: mm from the wafer centre (y away from the flat or notch). */
export interface SweepSite {
  xMm: number;
  yMm: number;
  label: string | null;
}

/** `GET /api/sweeps/:id`. */
export interface SweepDto extends SweepSummaryDto {
  columns: SweepColumn[];
  metadata: Record<string, string>;
  parseReport: SweepParseReport;
  points: SweepPointDto[];
}
