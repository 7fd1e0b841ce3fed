/**
 * Reads the data section of a sweep export with csv-parse, keeping each record's line number
 * in the file.
 */
import { CsvError, parse } from 'csv-parse/sync';
import { UnreadableFileError } from './decode';
import type { FileLayout } from './layout';

/** Data rows as text cells, with the 1-based file line of each. */
export interface DataTable {
  records: string[][];
  lines: number[];
}

function isBlankOrComment(record: string[]): boolean {
  if (record.length === 1 && record[0]!.trim() === '') return true;
  const first = record[0]!.trimStart();
  return first.startsWith('#') || first.startsWith('//');
}

function countLines(text: string): number {
  let n = 0;
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) n++;
  if (n === 0 && text.includes('\r')) n = text.split('\r').length - 1;
  // A last line without a line break still counts.
  const last = text.charCodeAt(text.length - 1);
  return last === 10 || last === 13 ? n : n + 1;
}

/**
 * Where the quote that never closes opens: the character offset of a `"` starting a field with
 * no closing quote after it (a `""` inside quotes is an escaped quote), or -1.
 */
function unclosedQuoteAt(data: string, delimiter: string): number {
  let fieldStart = true;
  for (let i = 0; i < data.length; i++) {
    const ch = data[i]!;
    if (fieldStart && ch === '"') {
      let j = i + 1;
      for (; j < data.length; j++) {
        if (data[j] === '"') {
          if (data[j + 1] === '"') j++;
          else break;
        }
      }
      if (j >= data.length) return i;
      i = j;
      fieldStart = false;
      continue;
    }
    fieldStart = ch === delimiter || ch === '\n' || ch === '\r';
  }
  return -1;
}

/** csv-parse, with its errors (an unclosed quote) as a 422 naming the file line. */
function parseOrRefuse<T>(
  data: string,
  options: { delimiter: string } & Record<string, unknown>,
  firstLine: number,
): T {
  try {
    return parse(data, options) as T;
  } catch (error) {
    if (!(error instanceof CsvError)) throw error;
    const at = unclosedQuoteAt(data, options.delimiter);
    const where =
      at < 0
        ? `Row ${firstLine + (Number((error as { lines?: unknown }).lines) || 1) - 1}`
        : `Row ${firstLine + countLines(data.slice(0, at + 1)) - 1}`;
    const what =
      at < 0
        ? 'the text cannot be split into values'
        : 'a value opens a double quote (") that is never closed';
    throw new UnreadableFileError(
      `${where}: ${what}; the file may be cut short. Nothing was stored.`,
    );
  }
}

/**
 * Reads the data section a stretch of lines at a time (`readMore`), appending to `table`, so an
 * import can store what it has read while it reads on. Line-aligned stretches are safe only
 * when no quoted field can span lines: a data section holding a double quote anywhere is read
 * in one go.
 */
export class DataTableReader {
  readonly table: DataTable = { records: [], lines: [] };
  private offset: number;
  private line: number;
  private readonly whole: boolean;

  constructor(
    private readonly text: string,
    private readonly layout: FileLayout,
  ) {
    this.offset = layout.dataOffset;
    this.line = layout.dataLine;
    this.whole = text.indexOf('"', layout.dataOffset) !== -1;
  }

  /** True once the whole data section has been read. */
  get done(): boolean {
    return this.offset >= this.text.length;
  }

  /** Reads about `lines` more lines (all that are left with `Infinity`). */
  readMore(lines: number): void {
    if (this.done) return;
    let end = this.text.length;
    if (!this.whole && Number.isFinite(lines)) {
      let at = this.offset - 1;
      for (let n = 0; n < lines; n++) {
        at = this.text.indexOf('\n', at + 1);
        if (at === -1) break;
      }
      if (at !== -1) end = at + 1;
    }
    const data = this.text.slice(this.offset, end);
    const read = parseStretch(data, this.layout.delimiter, this.line);
    for (let i = 0; i < read.records.length; i++) {
      this.table.records.push(read.records[i]!);
      this.table.lines.push(read.lines[i]!);
    }
    this.line += countLines(data);
    this.offset = end;
  }
}

/**
 * The records of a stretch holding no double quote, split on its line breaks (all `\n`, or all
 * `\r\n`) and `delimiter`: what csv-parse gives for such text (it has nothing to unquote and
 * nothing to refuse), several times faster. Null for any other text, which csv-parse reads.
 */
export function splitPlain(data: string, delimiter: string): string[][] | null {
  if (data.includes('"')) return null;
  const lines = data.includes('\r') ? data.split('\r\n') : data.split('\n');
  if (lines[lines.length - 1] === '') lines.pop();
  const records: string[][] = new Array<string[]>(lines.length);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!;
    // a lone \r or \n left in a line: the breaks are mixed
    if (line.includes('\r') || line.includes('\n')) return null;
    records[i] = line.split(delimiter);
  }
  return records;
}

/** One stretch of data lines, starting at file line `firstLine`, as records with their lines. */
function parseStretch(data: string, delimiter: string, firstLine: number): DataTable {
  const options = {
    delimiter,
    relax_column_count: true,
    relax_quotes: true,
    skip_empty_lines: false,
  } as const;
  const records =
    splitPlain(data, delimiter) ?? parseOrRefuse<string[][]>(data, options, firstLine);
  const lines: number[] = [];
  const kept: string[][] = [];
  if (records.length === countLines(data)) {
    for (let i = 0; i < records.length; i++) {
      const r = records[i]!;
      if (isBlankOrComment(r)) continue;
      kept.push(r);
      lines.push(firstLine + i);
    }
    return { records: kept, lines };
  }
  const withInfo = parseOrRefuse<Array<{ record: string[]; info: { lines: number } }>>(
    data,
    { ...options, info: true },
    firstLine,
  );
  // `info.lines` is where a record ends; it starts on the line after the previous one ended.
  let start = 1;
  for (const { record, info } of withInfo) {
    if (!isBlankOrComment(record)) {
      kept.push(record);
      lines.push(firstLine + start - 1);
    }
    start = info.lines + 1;
  }
  return { records: kept, lines };
}
