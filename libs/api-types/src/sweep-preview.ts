/** What the import preview answers, and the saved import settings it offers. */
import type { SweepMapInput } from './maps';
import type {
  HallFactorName,
  RowProblem,
  SweepColumn,
  SweepColumnOverride,
  SweepGeometry,
  SweepGeometryInput,
  SweepMethod,
  TemperatureConversion,
} from './sweeps';

/** A row of the preview: the cells as read and their numbers (decimal mark applied). */
export interface PreviewRow {
  row: number;
  cells: string[];
  values: Array<number | null>;
}

/** `POST /api/wafers/:id/sweeps/preview`. */
export interface SweepPreviewResponse {
  delimiter: ',' | ';' | '\t';
  decimalMark: '.' | ',';
  metadata: Record<string, string>;
  columns: SweepColumn[];
  /** The first 20 data rows. */
  rows: PreviewRow[];
  rowCount: number;
  /** Rows that cannot be read as the columns were detected (text in a number column). */
  problems: RowProblem[];
  suggestedMethod: SweepMethod | null;
  /** How the temperature column would be converted (null when it cannot be yet). */
  temperature?: TemperatureConversion | null;
  /** Why there is no conversion yet (e.g. RTD ohms with no R0 until a station is chosen). */
  temperatureNote?: string | null;
  /**
   * The method the file was checked with: the one the request names, else the suggested one
   * (null when neither: choosing one is then a blocking problem).
   */
  method: SweepMethod | null;
  /** The station the sweep would be linked to: the one chosen, or the one the file names. */
  stationId: number | null;
  /** The geometry the store would convert with (null while it cannot). */
  geometry: SweepGeometry | null;
  /**
   * Everything that makes the store refuse the file with these choices, found by the same
   * checks the store runs; empty when the store would take it.
   */
  blocking: RowProblem[];
  /** What the store would warn about without refusing (points outside the station's range). */
  warnings: string[];
  /** Points the store would make (null while something blocks). */
  pointCount: number | null;
  /** The file's metadata lines that fill or disagree with the records. */
  metadataFindings: MetadataFinding[];
  /** The file's shape (separator and header), the key its saved settings are kept under. */
  shape: string;
  /** The shape in words. */
  shapeLabel: string;
  /** Settings saved for this shape and the sweep's station, offered for this file. */
  savedSettings: ImportSettingsDto | null;
}

/**
 * What a file's metadata lines say about a value the records also hold: it fills a value the
 * records lack, or disagrees with them (the user chooses which one the sweep is converted with).
 */
export interface MetadataFinding {
  /** The recognised key (`thicknessCm`, `diameterCm`, `spacingCm`, `sampleName`). */
  key: string;
  /** The value in words (`Thickness`, `Sample`). */
  label: string;
  /** The file's value in words with its unit (`380 µm`). */
  fileText: string;
  /** The record's value in words with where it is kept (`525 µm on the wafer`), or null. */
  recordText: string | null;
  agreement: 'fills' | 'disagrees';
  /** The geometry field that takes the file's value when the user chooses it (else null). */
  field: keyof SweepGeometryInput | null;
  /** The file's value in the field's unit (cm), when it has a field. */
  fileValue: number | null;
  /** Which value the sweep is converted with under the current choices. */
  using: 'file' | 'record';
  /** One sentence for the parse report and the preview. */
  sentence: string;
}

/** A separator or decimal mark given instead of the detected one. */
export interface SweepLayoutInput {
  delimiter?: ',' | ';' | '\t';
  decimalMark?: '.' | ',';
}

/**
 * How files of one shape from one station are read (`/api/import-settings`): offered by the
 * preview when a file of that shape from that station arrives again.
 */
export interface ImportSettingsDto {
  id: number;
  stationId: number;
  stationName: string | null;
  /** The file shape's key (`SweepPreviewResponse.shape`). */
  shape: string;
  /** The shape in words (separator, columns). */
  shapeLabel: string;
  method: SweepMethod;
  columns: SweepColumnOverride[];
  geometry: SweepGeometryInput;
  layout: SweepLayoutInput;
  savedById: number | null;
  savedByName: string | null;
  updatedAt: string;
  /** The Hall factor saved for Hall files of this shape (null: none saved). */
  hallFactor: number | HallFactorName | null;
  /** The map fields saved for map files of this shape (null: none saved). */
  map: SweepMapInput | null;
}

/** `PUT /api/import-settings`: saves (or replaces) the settings of a station and shape. */
export interface ImportSettingsInput {
  stationId: number;
  shape: string;
  /** The shape in words, as the preview gave it. */
  shapeLabel?: string;
  method: SweepMethod;
  columns: SweepColumnOverride[];
  geometry: SweepGeometryInput;
  layout: SweepLayoutInput;
  /** For Hall files: the Hall factor to preset. */
  hallFactor?: number | HallFactorName;
  /** For map files: the site pattern and edge exclusion to preset. */
  map?: SweepMapInput;
}
