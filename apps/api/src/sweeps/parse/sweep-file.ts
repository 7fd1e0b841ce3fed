/**
 * The pure sweep-file parser: bytes in, layout, columns and data rows out. No database, no
 * physics; the import service converts the rows.
 */
import {
  COLUMN_MEANINGS,
  type RowProblem,
  type SweepColumnOverride,
  type SweepMethod,
} from '@rhotrace/api-types';
import {
  guessColumns,
  NUMERIC_MEANINGS,
  suggestMethod,
  unitFitsMeaning,
  type ResolvedColumn,
} from './columns';
import { decodeText, UnreadableFileError } from './decode';
import { detectLayout, type FileLayout, type LayoutChoice } from './layout';
import { recogniseMetadata, type RecognisedMetadata } from './metadata';
import { readNumber } from './numbers';
import { DataTableReader, type DataTable } from './read-table';
import { parseUnit } from './units';

/** Most problems listed in one answer; the count says how many there were. */
export const MAX_PROBLEMS = 50;

/** A parsed file before conversion. */
export interface ParsedSweepFile {
  layout: FileLayout;
  columns: ResolvedColumn[];
  table: DataTable;
  recognised: RecognisedMetadata;
  suggestedMethod: SweepMethod | null;
  /** Rows whose number of cells differs from the header. */
  problems: RowProblem[];
}

/** A problem at a place in the file, with its description in words. */
export function rowProblem(row: number | null, column: string | null, problem: string): RowProblem {
  const where = [row === null ? null : `row ${row}`, column === null ? null : `column ${column}`]
    .filter(Boolean)
    .join(', ');
  return { row, column, problem, field: where || 'file' };
}

/**
 * A sweep file opened for reading a stretch at a time: `parsed.table` and `parsed.problems`
 * grow with each `readMore`, until `done`.
 */
export interface OpenedSweepFile {
  parsed: ParsedSweepFile;
  readonly done: boolean;
  /** Reads about `lines` more lines of the data section. */
  readMore(lines: number): void;
}

/**
 * Decodes the file, finds its layout (with the separator and decimal mark `chosen` where the
 * user gave them) and columns and reads the first `firstLines` lines of data (at least one
 * record when there is one). Throws `UnreadableFileError` for a file with no rows of numbers.
 */
export function openSweepFile(
  bytes: Buffer,
  firstLines = Infinity,
  chosen: LayoutChoice = {},
): OpenedSweepFile {
  if (chosen.delimiter === ',' && chosen.decimalMark === ',') {
    throw new UnreadableFileError(
      'A comma cannot separate both the values and the decimals: choose another separator',
      400,
    );
  }
  const text = decodeText(bytes);
  const layout = detectLayout(text, chosen);
  if (!layout) {
    throw new UnreadableFileError(
      'No rows of numbers were found. Rhotrace reads files whose columns are separated by ' +
        'commas, semicolons or tabs, with one reading per line.',
    );
  }
  const reader = new DataTableReader(text, layout);
  const table = reader.table;
  do reader.readMore(firstLines);
  while (!reader.done && table.records.length === 0);
  const width = Math.max(layout.headers.length, table.records[0]?.length ?? 0);
  const columns = guessColumns(layout.headers, layout.units, width);
  const recognised = recogniseMetadata(layout.metadata);
  const problems: RowProblem[] = [];
  let checked = 0;
  /** Rows whose number of cells differs from the header (extra empty cells are fine). */
  const checkWidths = () => {
    for (; checked < table.records.length && problems.length < MAX_PROBLEMS; checked++) {
      const record = table.records[checked]!;
      const n = record.length;
      if (n !== width && !(n > width && record.slice(width).every((c) => c.trim() === ''))) {
        problems.push(
          rowProblem(table.lines[checked]!, null, `expected ${width} values, found ${n}`),
        );
      }
    }
  };
  checkWidths();
  const parsed: ParsedSweepFile = {
    layout,
    columns,
    table,
    recognised,
    suggestedMethod: suggestMethod(columns, recognised.method ?? null),
    problems,
  };
  return {
    parsed,
    get done() {
      return reader.done;
    },
    readMore(lines: number) {
      reader.readMore(lines);
      checkWidths();
    },
  };
}

/** Reads the whole file: layout, columns, every data row and the rows of the wrong width. */
export function parseSweepFile(bytes: Buffer): ParsedSweepFile {
  return openSweepFile(bytes).parsed;
}

/**
 * Applies a user's mapping: listed columns take the given meaning and unit; an unlisted column
 * keeps its guess unless a listed one claimed that meaning. Invalid entries throw a list of
 * `{ field, problem }`.
 */
export function applyColumnOverrides(
  columns: ResolvedColumn[],
  overrides: SweepColumnOverride[],
): { columns: ResolvedColumn[]; problems: Array<{ field: string; problem: string }> } {
  const problems: Array<{ field: string; problem: string }> = [];
  const out = columns.map((c) => ({ ...c }));
  const claimed = new Set<string>();
  overrides.forEach((o, k) => {
    const at = `columns.${k}`;
    const col = out[o.index];
    if (!col) {
      problems.push({
        field: `${at}.index`,
        problem: `the file has no column ${o.index} (it has ${out.length})`,
      });
      return;
    }
    if (!(COLUMN_MEANINGS as readonly string[]).includes(o.meaning)) {
      problems.push({
        field: `${at}.meaning`,
        problem: `must be one of ${COLUMN_MEANINGS.join(', ')}`,
      });
      return;
    }
    let unitInfo = col.meaning === o.meaning ? col.unitInfo : null;
    if (o.unit !== undefined && o.unit !== null && o.unit !== '') {
      unitInfo = parseUnit(o.unit);
      if (!unitInfo || !unitFitsMeaning(o.meaning, unitInfo)) {
        problems.push({
          field: `${at}.unit`,
          problem: `"${o.unit}" is not a unit for ${o.meaning}`,
        });
        return;
      }
    } else if (!unitInfo && NUMERIC_MEANINGS.has(o.meaning)) {
      unitInfo = guessColumns([o.meaning], null, 1)[0]!.unitInfo;
    }
    if (
      o.meaning !== 'other' &&
      o.meaning !== 'index' &&
      o.meaning !== 'time' &&
      claimed.has(o.meaning)
    ) {
      problems.push({ field: `${at}.meaning`, problem: `${o.meaning} is given to two columns` });
      return;
    }
    claimed.add(o.meaning);
    Object.assign(col, {
      meaning: o.meaning,
      unit: unitInfo?.label ?? null,
      unitInfo,
      confidence: 1,
    });
    (col as { overridden?: boolean }).overridden = true;
  });
  for (const c of out as Array<ResolvedColumn & { overridden?: boolean }>) {
    if (!c.overridden && claimed.has(c.meaning) && c.meaning !== 'other') {
      Object.assign(c, { meaning: 'other', unit: null, unitInfo: null, confidence: 0 });
    }
    delete c.overridden;
  }
  return { columns: out, problems };
}

/** Cells of mapped numeric columns that do not read as numbers (first `MAX_PROBLEMS`). */
export function unreadableCells(parsed: ParsedSweepFile, columns: ResolvedColumn[]): RowProblem[] {
  const problems: RowProblem[] = [];
  const mark = parsed.layout.decimalMark;
  const numeric = columns.filter((c) => NUMERIC_MEANINGS.has(c.meaning));
  const { records, lines } = parsed.table;
  for (let i = 0; i < records.length && problems.length < MAX_PROBLEMS; i++) {
    for (const c of numeric) {
      const cell = records[i]![c.index] ?? '';
      if (readNumber(cell, mark) === undefined) {
        problems.push(rowProblem(lines[i]!, c.header, `"${cell.trim()}" is not a number`));
      }
    }
  }
  return problems;
}

export { UnreadableFileError };
