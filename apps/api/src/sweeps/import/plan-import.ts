/**
 * Stage 2 and the geometry, for the preview and the store alike: the user's choices for one file
 * (method, station, column mapping, geometry) checked against the file and the wafer's records.
 * Every problem that makes the store refuse the file is collected in one 400, so the preview can
 * list them all at once and the store refuses with the same words.
 */
import type {
  FieldProblem,
  HallFactorName,
  MetadataFinding,
  RowProblem,
  SweepColumnOverride,
  SweepGeometry,
  SweepGeometryInput,
  SweepMapInput,
  SweepMethod,
  StationSensor,
} from '@rhotrace/api-types';
import type { Transaction } from 'sequelize';
import { HttpError, validationFailed } from '../../errors';
import type { Lot } from '../../lots/lot.model';
import { calibrationWarning } from '../../stations/calibration';
import type { Station } from '../../stations/station.model';
import { toStationDto } from '../../stations/stations.service';
import type { Wafer } from '../../wafers/wafer.model';
import {
  applyColumnOverrides,
  type LayoutChoice,
  type ParsedSweepFile,
  type ResolvedColumn,
} from '../parse';
import { detectColumns } from './detect-columns';
import { findStation } from './find-station';
import { hallSettings } from './hall-summary';
import { readMetadata, type MetadataRecords } from './read-metadata';
import { resolveGeometry } from './resolve-geometry';
import { hasSites, SitePlacer } from './sites';
import { temperatureReader, type TemperatureReader } from './temperature';

/** What the user chose for one file: the store request's fields. */
export interface ImportChoices {
  method: SweepMethod;
  stationId?: number | null;
  columns?: SweepColumnOverride[];
  geometry?: SweepGeometryInput;
  /** The separator and decimal mark, where the user corrected the detected ones. */
  layout?: LayoutChoice;
  /** Hall sweeps: r_H as a number or a named scattering factor (default 1). */
  hallFactor?: number | HallFactorName;
  /** Map fields (site pattern, edge exclusion); used when the columns place readings at sites. */
  map?: SweepMapInput;
}

/** Builds a map's site placer over the converter's problem list (null: not a map). */
export type PlacerFactory = ((problems: RowProblem[]) => SitePlacer) | null;

/** What the file is converted with once the choices passed their checks. */
export interface ImportPlan {
  columns: ResolvedColumn[];
  station: Station | null;
  geometry: SweepGeometry;
  /** Warnings of the planning itself (a station named in the file but not registered). */
  warnings: string[];
  /** The file's metadata lines that fill or disagree with the records. */
  metadata: MetadataFinding[];
  /** What the method computes with besides the geometry (the Hall factor). */
  settings: ReturnType<typeof hallSettings>;
  /** Places a map's readings on the wafer (null when the columns carry no sites). */
  placer: PlacerFactory;
  /** How the temperature column becomes kelvin (thermocouple, RTD, table, K or °C). */
  temperature: TemperatureReader;
}

/** The wafer and lot an upload goes to. */
export interface ImportRecords {
  wafer: Pick<Wafer, 'id' | 'number' | 'thicknessCm'>;
  lot: Pick<Lot, 'code' | 'thicknessCm' | 'diameterCm'>;
}

/** Runs a check; a 400 it throws adds its message and details to `problems` instead. */
async function collect<T>(
  problems: { message: string; details: FieldProblem[] }[],
  step: () => T | Promise<T>,
): Promise<T | null> {
  try {
    return await step();
  } catch (error) {
    if (!(error instanceof HttpError) || error.status !== 400) throw error;
    const details = Array.isArray(error.details) ? error.details : [];
    problems.push({ message: error.message, details });
    return null;
  }
}

/**
 * Checks the choices for a parsed file: the mapping fits the method, the station exists, the
 * geometry the method needs is known. Throws one 400 listing every problem (its message is the
 * first problem's), or returns what the rows are converted with.
 */
export async function planImport(
  parsed: ParsedSweepFile,
  choices: ImportChoices,
  records: ImportRecords,
  transaction?: Transaction,
): Promise<ImportPlan> {
  const problems: { message: string; details: FieldProblem[] }[] = [];
  const warnings: string[] = [];
  const overrides = choices.columns ?? [];
  const columns = await collect(problems, () => detectColumns(parsed, overrides, choices.method));
  const station = await collect(problems, () =>
    findStation(choices.stationId, parsed.recognised.stationName, warnings, transaction),
  );
  // The geometry is checked even when the mapping was refused, so both are listed at once.
  const mapped = columns ?? applyColumnOverrides(parsed.columns, overrides).columns;
  const temperatureColumn = mapped.find((c) => c.meaning === 'temperature');
  const isMap = hasSites(mapped);
  const geometry = await collect(problems, () =>
    resolveGeometry({
      method: choices.method,
      request: choices.geometry ?? {},
      wafer: records.wafer,
      lot: records.lot,
      station,
      file: parsed.recognised,
      needsRtd: needsRtd(temperatureColumn, station),
      isMap,
    }),
  );
  const placer = await collect(problems, () => placerOf(choices, columns, geometry));
  // A missing thermocouple type or cold junction joins the plan's 400 (RTD ohms without R0
  // are already named by the geometry, so they wait for it).
  const temperature =
    temperatureColumn && (geometry || temperatureColumn.unitInfo?.kind !== 'resistance')
      ? await collect(problems, () =>
          temperatureReader({
            column: temperatureColumn,
            referenceColumn: mapped.some((c) => c.meaning === 'reference-junction'),
            sensor: stationSensor(station),
            file: parsed.recognised,
            geometry: geometry ?? {},
          }),
        )
      : null;
  const settings = await collect(problems, () => hallSettings(choices.method, choices.hallFactor));
  const uncalibrated = station ? calibrationWarning(station) : null;
  if (uncalibrated) warnings.push(uncalibrated);
  if (problems.length || !columns || !geometry || !settings || placer === null || !temperature) {
    throw validationFailed(
      problems[0]?.message ?? 'The file cannot be imported as chosen',
      problems.flatMap((p) => p.details),
    );
  }
  const compared: MetadataRecords = { ...records, station };
  const metadata = readMetadata(parsed.recognised, compared, choices.geometry ?? {});
  return {
    columns,
    station,
    geometry,
    warnings,
    metadata,
    settings,
    placer: placer.factory,
    temperature,
  };
}

/** RTD ohms need R0 unless the station reads its ohms through its own table. */
function needsRtd(column: ResolvedColumn | undefined, station: Station | null): boolean {
  return column?.unitInfo?.kind === 'resistance' && station?.sensor?.kind !== 'table';
}

/** The station's sensor (null without a station). */
function stationSensor(station: Station | null): StationSensor | null {
  // a station written before sensors (or by a seeder) reads through its older fields
  return station ? (toStationDto(station).sensor ?? null) : null;
}

/**
 * A map's placer factory, its fields (pattern, edge exclusion, diameter) checked once here so a
 * refusal joins the plan's 400; `factory` is null when the columns carry no sites.
 */
function placerOf(
  choices: ImportChoices,
  columns: ResolvedColumn[] | null,
  geometry: SweepGeometry | null,
): { factory: PlacerFactory } {
  if (!columns || !geometry || !hasSites(columns)) return { factory: null };
  const make = (problems: RowProblem[]) =>
    new SitePlacer(choices.map ?? {}, choices.method, columns, geometry, problems);
  make([]);
  return { factory: make };
}
