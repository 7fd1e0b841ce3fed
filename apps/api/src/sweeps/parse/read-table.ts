/**
 * Reads the data section of a sweep export with csv-parse, keeping each record's line number
 * in the file.
 */
import { parse } from 'csv-parse/sync';
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
 * Parses the data section. Without csv-parse's per-record info (three times slower) a record
 * is one line; a quoted field spanning lines breaks that, so then the slower path runs.
 */
export function readDataTable(text: string, layout: FileLayout): DataTable {
  const data = text.slice(layout.dataOffset);
  const options = {
    delimiter: layout.delimiter,
    relax_column_count: true,
    relax_quotes: true,
    skip_empty_lines: false,
  } as const;
  const records = parse(data, options) as string[][];
  const lines: number[] = [];
  const kept: string[][] = [];
  if (records.length === countLines(data)) {
    for (let i = 0; i < records.length; i++) {
      const r = records[i]!;
      if (isBlankOrComment(r)) continue;
      kept.push(r);
      lines.push(layout.dataLine + i);
    }
    return { records: kept, lines };
  }
  const withInfo = parse(data, { ...options, info: true }) as unknown as Array<{
    record: string[];
    info: { lines: number };
  }>;
  // `info.lines` is where a record ends; it starts on the line after the previous one ended.
  let start = 1;
  for (const { record, info } of withInfo) {
    if (!isBlankOrComment(record)) {
      kept.push(record);
      lines.push(layout.dataLine + start - 1);
    }
    start = info.lines + 1;
  }
  return { records: kept, lines };
}
