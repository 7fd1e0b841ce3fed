export { guessColumns, suggestMethod, NUMERIC_MEANINGS, type ResolvedColumn } from './columns';
export { decodeText, UnreadableFileError } from './decode';
export {
  detectLayout,
  splitLine,
  type Delimiter,
  type FileLayout,
  type LayoutChoice,
} from './layout';
export { recogniseMetadata, readLengthCm, type RecognisedMetadata } from './metadata';
export { readNumber, type DecimalMark } from './numbers';
export { DataTableReader, type DataTable } from './read-table';
export {
  applyColumnOverrides,
  MAX_PROBLEMS,
  openSweepFile,
  parseSweepFile,
  rowProblem,
  unreadableCells,
  type OpenedSweepFile,
  type ParsedSweepFile,
} from './sweep-file';
export { parseUnit, splitHeader, type Unit, type UnitKind } from './units';
