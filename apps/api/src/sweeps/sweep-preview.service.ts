/**
 * The preview of an upload: the file parsed without storing, its guessed columns, first rows and
 * problems, and the temperature conversion the import would use.
 */
import type { SweepPreviewResponse, TemperatureConversion } from '@rhotrace/api-types';
import { mayUploadTo } from '../access/visibility.service';
import { publicColumns } from './import/detect-columns';
import { findStation } from './import/find-station';
import { readTable } from './import/read-table';
import { temperatureReader } from './import/temperature';
import { readNumber, unreadableCells } from './parse';
import { stationSensor, type SweepActor } from './sweep-import.service';

/** Rows the preview shows. */
export const PREVIEW_ROWS = 20;

/**
 * The conversion the import would use for the guessed temperature column, with the station
 * given or named in the file; null (with what is missing in `notes`) when it has none yet: the
 * upload may still supply it (a station, a mapped reference-junction column).
 */
async function previewConversion(
  parsed: ReturnType<typeof readTable>,
  stationId: number | undefined,
  notes: string[],
): Promise<TemperatureConversion | null> {
  const column = parsed.columns.find((c) => c.meaning === 'temperature');
  if (!column) return null;
  const station = await findStation(stationId, parsed.recognised.stationName, [], undefined);
  try {
    return temperatureReader({
      column,
      referenceColumn: parsed.columns.some((c) => c.meaning === 'reference-junction'),
      sensor: stationSensor(station),
      file: parsed.recognised,
      geometry: { rtdR0Ohm: parsed.recognised.rtdR0Ohm ?? station?.rtdR0Ohm ?? undefined },
    }).conversion;
  } catch (error) {
    const details = (error as { details?: Array<{ problem: string }> }).details;
    if (!details) throw error;
    notes.push(...details.map((d) => d.problem));
    return null;
  }
}

/** Parses without storing: layout, guessed columns, the first rows and the problems found. */
export async function previewSweep(
  input: { waferId: number; file: Buffer; stationId?: number },
  actor: SweepActor,
): Promise<SweepPreviewResponse> {
  await mayUploadTo(actor, input.waferId);
  const parsed = readTable(input.file);
  const { layout, table } = parsed;
  const rows = table.records.slice(0, PREVIEW_ROWS).map((cells, i) => ({
    row: table.lines[i]!,
    cells,
    values: cells.map((c) => readNumber(c, layout.decimalMark) ?? null),
  }));
  const problems = [...parsed.problems, ...unreadableCells(parsed, parsed.columns)];
  const notes: string[] = [];
  const temperature = await previewConversion(parsed, input.stationId, notes);
  return {
    delimiter: layout.delimiter,
    decimalMark: layout.decimalMark,
    metadata: layout.metadata,
    columns: publicColumns(parsed.columns),
    rows,
    rowCount: table.records.length,
    problems: problems.slice(0, 50),
    suggestedMethod: parsed.suggestedMethod,
    temperature,
    temperatureNote: notes[0] ?? null,
  };
}
