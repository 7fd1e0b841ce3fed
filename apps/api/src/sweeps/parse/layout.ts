/**
 * Finds the shape of a sweep export: the column separator, the decimal mark, the metadata lines
 * before the header, the header line and where the data starts.
 */
import { looksNumeric, type DecimalMark } from './numbers';
import { parseUnit } from './units';

export type Delimiter = ',' | ';' | '\t';

/** How a file is laid out. Line numbers are 1-based, as a text editor shows them. */
export interface FileLayout {
  delimiter: Delimiter;
  decimalMark: DecimalMark;
  /** Header cells (empty when the file has no header line). */
  headers: string[];
  headerLine: number | null;
  /** Units row under the header, when the file has one. */
  unitsLine: number | null;
  units: string[] | null;
  /** First line of the data section, and its character offset in the text. */
  dataLine: number;
  dataOffset: number;
  metadata: Record<string, string>;
}

/** Lines examined to find the layout; the data section itself is read by csv-parse. */
const HEAD_LINES = 400;
const HEAD_CHARS = 256 * 1024;
/** Candidate separators in order of preference when several split the lines consistently. */
const DELIMITERS: Delimiter[] = ['\t', ';', ','];

/** Splits one line on `delimiter`, honouring double quotes (`"a,b"` and `""` escapes). */
export function splitLine(line: string, delimiter: string): string[] {
  if (!line.includes('"')) return line.split(delimiter);
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i]!;
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (ch === delimiter) {
      cells.push(cell);
      cell = '';
    } else cell += ch;
  }
  cells.push(cell);
  return cells;
}

/** A blank line or a comment line (`#`, `//`, `;` lines are not comments: `;` is a separator). */
export function isSkippable(line: string): boolean {
  const t = line.trim();
  return t === '' || t.startsWith('#') || t.startsWith('//');
}

function isNumericRow(cells: string[]): boolean {
  const filled = cells.filter((c) => c.trim() !== '');
  if (filled.length < 2) return false;
  return filled.filter(looksNumeric).length * 2 >= filled.length;
}

/** Two or more cells, every filled one a number. */
function isAllNumbers(cells: string[]): boolean {
  const filled = cells.filter((c) => c.trim() !== '');
  return filled.length >= 2 && filled.every(looksNumeric);
}

function mode(values: number[]): { value: number; share: number } {
  const counts = new Map<number, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  let best = 0;
  let bestCount = 0;
  for (const [v, c] of counts)
    if (c > bestCount || (c === bestCount && v > best)) [best, bestCount] = [v, c];
  return { value: best, share: values.length ? bestCount / values.length : 0 };
}

function chooseDelimiter(
  lines: string[],
  candidates: Delimiter[],
): { delimiter: Delimiter; width: number } | null {
  let best: { delimiter: Delimiter; width: number; score: number } | null = null;
  for (const d of candidates) {
    const rows = lines
      .filter((l) => !isSkippable(l) && l.includes(d))
      .map((l) => splitLine(l, d))
      .filter(isNumericRow);
    if (rows.length === 0) continue;
    const m = mode(rows.map((r) => r.length));
    if (m.value < 2) continue;
    const score = rows.length * m.share;
    if (!best || score > best.score * 1.2) best = { delimiter: d, width: m.value, score };
  }
  return best && { delimiter: best.delimiter, width: best.width };
}

function chooseDecimalMark(rows: string[][], delimiter: Delimiter): DecimalMark {
  if (delimiter === ',') return '.';
  let comma = 0;
  let point = 0;
  for (const row of rows) {
    for (const c of row) {
      const t = c.trim();
      if (/^[-+]?\d*,\d+(?:[eE][-+]?\d+)?$/.test(t)) comma++;
      else if (/^[-+]?\d*\.\d+(?:[eE][-+]?\d+)?$/.test(t)) point++;
    }
  }
  return comma > point ? ',' : '.';
}

/** Reads `key: value`, `key = value` or `key<sep>value` from a line before the header. */
function metadataPair(line: string, delimiter: Delimiter): [string, string] | null {
  const t = line.trim().replace(/^(#|\/\/)\s*/, '');
  const cells = splitLine(t, delimiter).map((c) => c.trim());
  if (cells.length >= 2 && cells[0] !== '' && !/[:=]/.test(cells[0]!)) {
    return [
      cells[0]!,
      cells
        .slice(1)
        .filter((c) => c !== '')
        .join(' '),
    ];
  }
  const colon = /^([^:=]{1,80}?)\s*[:=]\s*(.*)$/.exec(t);
  if (colon) return [colon[1]!.trim(), colon[2]!.trim()];
  return null;
}

function isUnitsRow(cells: string[]): boolean {
  const filled = cells
    .map((c) => c.trim().replace(/^[[(]\s*|\s*[)\]]$/g, ''))
    .filter((c) => c !== '');
  return filled.length >= 2 && filled.every((c) => parseUnit(c) !== null);
}

/** A separator or decimal mark the user gave instead of the detected one. */
export interface LayoutChoice {
  delimiter?: Delimiter;
  decimalMark?: DecimalMark;
}

/**
 * Works out the layout from the first lines of the text, with the separator and decimal mark
 * `chosen` where the user gave them. Returns null when no rows of numbers separated by comma,
 * semicolon or tab (or by the chosen separator) are found.
 */
export function detectLayout(text: string, chosen: LayoutChoice = {}): FileLayout | null {
  const head = text
    .slice(0, HEAD_CHARS)
    .split(/\r\n|\n|\r/)
    .slice(0, HEAD_LINES);
  // The last line of a cut sample may be partial.
  if (text.length > HEAD_CHARS) head.pop();
  const choice = chooseDelimiter(head, chosen.delimiter ? [chosen.delimiter] : DELIMITERS);
  if (!choice) return null;
  const { delimiter, width } = choice;
  const split = head.map((l) => (isSkippable(l) ? null : splitLine(l, delimiter)));
  let dataIndex = split.findIndex(
    (cells) => cells !== null && cells.length === width && isNumericRow(cells),
  );
  if (dataIndex < 0) return null;
  // Rows of numbers just above it with another width are data too (ragged rows, reported by
  // row later), never metadata that would be dropped.
  while (dataIndex > 0 && split[dataIndex - 1] !== null && isAllNumbers(split[dataIndex - 1]!)) {
    dataIndex--;
  }

  let headerIndex: number | null = null;
  let unitsIndex: number | null = null;
  let k = dataIndex - 1;
  while (k >= 0 && split[k] === null) k--;
  if (k >= 0 && split[k]!.length >= 2 && !isNumericRow(split[k]!)) {
    headerIndex = k;
    let j = k - 1;
    while (j >= 0 && split[j] === null) j--;
    if (
      j >= 0 &&
      split[j]!.length === split[k]!.length &&
      isUnitsRow(split[k]!) &&
      !isUnitsRow(split[j]!)
    ) {
      unitsIndex = k;
      headerIndex = j;
    }
  }

  const metadata: Record<string, string> = {};
  const metaEnd = headerIndex ?? dataIndex;
  for (let i = 0; i < metaEnd; i++) {
    const line = head[i]!;
    if (line.trim() === '') continue;
    const pair = metadataPair(line, delimiter);
    if (!pair) continue;
    let key = pair[0];
    for (let n = 2; key in metadata; n++) key = `${pair[0]} (${n})`;
    metadata[key] = pair[1];
  }

  const dataRows = split.slice(dataIndex).filter((c): c is string[] => c !== null);
  let offset = 0;
  for (let i = 0; i < dataIndex; i++) {
    offset += head[i]!.length;
    // Step over the line break that ended this line (\r\n, \n or \r).
    if (text[offset] === '\r' && text[offset + 1] === '\n') offset += 2;
    else offset += 1;
  }
  const cells = (i: number | null) => (i === null ? null : split[i]!.map((c) => c.trim()));
  return {
    delimiter,
    decimalMark: chosen.decimalMark ?? chooseDecimalMark(dataRows.slice(0, 200), delimiter),
    headers: cells(headerIndex) ?? [],
    headerLine: headerIndex === null ? null : headerIndex + 1,
    unitsLine: unitsIndex === null ? null : unitsIndex + 1,
    units: cells(unitsIndex),
    dataLine: dataIndex + 1,
    dataOffset: offset,
    metadata,
  };
}
