/**
 * Stage 1, read the table: bytes to layout, columns and records, a slice at a time, with the
 * parser's refusals as the API's 400 and 422.
 */
import type { RowProblem } from '@rhotrace/api-types';
import { unprocessable, validationFailed } from '../../errors';
import {
  MAX_PROBLEMS,
  openSweepFile,
  UnreadableFileError,
  type LayoutChoice,
  type OpenedSweepFile,
  type ParsedSweepFile,
} from '../parse';

/** Runs a step of reading the file, with its errors as the API's 400 or 422. */
function reading<T>(step: () => T): T {
  try {
    return step();
  } catch (error) {
    if (error instanceof UnreadableFileError) {
      throw error.status === 400
        ? validationFailed(error.message, [{ field: 'file', problem: error.message }])
        : unprocessable(error.message, [{ field: 'file', problem: error.message }]);
    }
    throw error;
  }
}

/** The whole file read at once (the preview). */
export function readTable(bytes: Buffer): ParsedSweepFile {
  return reading(() => openSweepFile(bytes).parsed);
}

/**
 * The file opened with its first `sliceRows` records read (the rest come with `slices`), with
 * the separator and decimal mark the user `chosen`, if any.
 */
export function openTable(
  bytes: Buffer,
  sliceRows: number,
  chosen: LayoutChoice = {},
): OpenedSweepFile {
  return reading(() => openSweepFile(bytes, sliceRows, chosen));
}

/** The 422 for rows that cannot be read (a wrong number of values). */
export function unreadableRows(problems: RowProblem[]): Error {
  return unprocessable(
    'Some rows cannot be read; nothing was stored',
    problems.slice(0, MAX_PROBLEMS),
  );
}

/** Records `start` to `end` (exclusive) of the table; `more` tells whether records follow. */
export interface Slice {
  start: number;
  end: number;
  more: boolean;
}

/**
 * The table's records in slices of `sliceRows`, each read from the file just before it is
 * given out, so the caller can store one slice while the next is read; none is read once
 * `wanted` says false. A row of the wrong width throws the 422, after reading on to name the
 * others (as a whole-file read would).
 */
export function* slices(
  file: OpenedSweepFile,
  sliceRows: number,
  wanted: () => boolean = () => true,
): Generator<Slice> {
  const { records } = file.parsed.table;
  const problems = file.parsed.problems;
  for (let start = 0; wanted(); start += sliceRows) {
    const end = start + sliceRows;
    while (!file.done && records.length < end) reading(() => file.readMore(sliceRows));
    if (problems.length) {
      while (!file.done && problems.length < MAX_PROBLEMS) {
        reading(() => file.readMore(sliceRows));
      }
      throw unreadableRows(problems);
    }
    if (start >= records.length) return;
    yield { start, end: Math.min(records.length, end), more: !file.done || end < records.length };
  }
}
