/**
 * The preview of a sweep file: its layout, detected columns and first rows, and the verdict of
 * the same checks the store runs (`planImport`, then `SweepRows` over every row), so a file the
 * preview passes is one the store takes and a file it would refuse is refused here, in the same
 * words, before anything is sent to be stored. It says how the temperature column would become
 * kelvin (the plan's conversion), or why it cannot yet.
 */
import { createHash } from 'node:crypto';
import type { FieldProblem, RowProblem, SweepPreviewResponse } from '@rhotrace/api-types';
import { mayUploadTo } from '../access/visibility.service';
import { HttpError } from '../errors';
import { findImportSettings } from '../import-settings/import-settings.service';
import { SweepRows } from './import/check-rows';
import { publicColumns } from './import/detect-columns';
import { fileShape } from './import/file-shape';
import { findStation } from './import/find-station';
import { planImport, type ImportChoices, type ImportPlan } from './import/plan-import';
import { openTable } from './import/read-table';
import { MAX_PROBLEMS, readNumber, unreadableCells, type OpenedSweepFile } from './parse';
import { IMPORT_SLICE_ROWS, type SweepActor } from './sweep-import.service';
import { Sweep } from './sweep.model';

/** Rows the preview shows. */
export const PREVIEW_ROWS = 20;

/** A 400's field problems as problems with no row. */
function asRowProblems(details: FieldProblem[]): RowProblem[] {
  return details.map((d) => ({ row: null, column: null, field: d.field, problem: d.problem }));
}

/** The plan, or null after adding the store's 400 for these choices to `blocking`. */
async function tryPlan(
  plan: () => Promise<ImportPlan>,
  blocking: RowProblem[],
): Promise<ImportPlan | null> {
  try {
    return await plan();
  } catch (error) {
    if (!(error instanceof HttpError) || error.status !== 400) throw error;
    const details = Array.isArray(error.details) ? error.details : [];
    blocking.push(
      ...asRowProblems(details.length ? details : [{ field: 'file', problem: error.message }]),
    );
    return null;
  }
}

/** Runs every row through the store's stages without storing; returns the point count. */
function convertAll(
  file: OpenedSweepFile,
  plan: ImportPlan,
  method: ImportChoices['method'],
  blocking: RowProblem[],
  warnings: string[],
): number | null {
  const rows = new SweepRows(file, plan, method, IMPORT_SLICE_ROWS);
  let count = 0;
  for (const points of rows.points()) count += points.length;
  if (rows.problems.length) {
    blocking.push(...rows.problems.slice(0, MAX_PROBLEMS));
    return null;
  }
  warnings.push(...rows.finish().warnings);
  return count;
}

/** The station a file goes with when its plan failed: the chosen one, or the one it names. */
async function stationOf(
  choices: Partial<ImportChoices>,
  parsed: OpenedSweepFile['parsed'],
): Promise<number | null> {
  try {
    const station = await findStation(choices.stationId, parsed.recognised.stationName, []);
    return station?.id ?? null;
  } catch (error) {
    if (error instanceof HttpError && error.status === 400) return null;
    throw error;
  }
}

/**
 * Parses without storing and checks the file with `choices` (the store request's fields; the
 * method defaults to the suggested one): what the store would refuse is listed in `blocking`,
 * what it would warn about in `warnings`.
 */
export async function previewSweep(
  input: { waferId: number; file: Buffer; choices?: Partial<ImportChoices> },
  actor: SweepActor,
): Promise<SweepPreviewResponse> {
  const { wafer, lot } = await mayUploadTo(actor, input.waferId);
  const choices = input.choices ?? {};
  const file = openTable(input.file, Infinity, choices.layout);
  const parsed = file.parsed;
  const { layout, table } = parsed;
  const method = choices.method ?? parsed.suggestedMethod;
  const blocking: RowProblem[] = [...parsed.problems];
  const warnings: string[] = [];
  let plan: ImportPlan | null = null;
  let pointCount: number | null = null;
  if (!method) {
    blocking.push(...asRowProblems([{ field: 'method', problem: 'choose the method' }]));
  } else {
    plan = await tryPlan(
      () => planImport(parsed, { ...choices, method }, { wafer, lot }),
      blocking,
    );
    if (plan) warnings.push(...plan.warnings);
    if (plan && blocking.length === 0) {
      pointCount = convertAll(file, plan, method, blocking, warnings);
    }
  }
  const sha256 = createHash('sha256').update(input.file).digest('hex');
  const earlier = await Sweep.findOne({ where: { waferId: wafer.id, sha256 }, attributes: ['id'] });
  if (earlier) {
    blocking.unshift(
      ...asRowProblems([
        {
          field: 'file',
          problem: `this file was already uploaded to this wafer as sweep ${earlier.id}`,
        },
      ]),
    );
    pointCount = null;
  }
  const shape = fileShape(parsed);
  const stationId = plan ? (plan.station?.id ?? null) : await stationOf(choices, parsed);
  const rows = table.records.slice(0, PREVIEW_ROWS).map((cells, i) => ({
    row: table.lines[i]!,
    cells,
    values: cells.map((c) => readNumber(c, layout.decimalMark) ?? null),
  }));
  return {
    delimiter: layout.delimiter,
    decimalMark: layout.decimalMark,
    metadata: layout.metadata,
    columns: publicColumns(plan?.columns ?? parsed.columns),
    rows,
    rowCount: table.records.length,
    problems: [...parsed.problems, ...unreadableCells(parsed, parsed.columns)].slice(0, 50),
    suggestedMethod: parsed.suggestedMethod,
    method,
    stationId,
    geometry: plan?.geometry ?? null,
    blocking,
    warnings,
    pointCount,
    metadataFindings: plan?.metadata ?? [],
    temperature: plan?.temperature.conversion ?? null,
    temperatureNote: blocking.find((b) => b.field === 'temperature')?.problem ?? null,
    shape: shape.key,
    shapeLabel: shape.label,
    savedSettings: await findImportSettings(stationId, shape.key),
  };
}
