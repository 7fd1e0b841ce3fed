/**
 * Turns parsed rows into points: temperature in kelvin, raw readings in SI units, sheet
 * resistance and resistivity through `@rhotrace/physics`. Problems are collected per row and
 * column; the caller stores all points or none.
 */
import {
  barResistivity,
  celsiusToKelvin,
  fourPointProbe,
  resistivityFromSheetResistance,
  rtdTemperatureK,
  vanDerPauw,
} from '@rhotrace/physics';
import type {
  ColumnMeaning,
  PointFlag,
  RowProblem,
  SweepGeometry,
  SweepMethod,
} from '@rhotrace/api-types';
import { validationFailed } from '../errors';
import {
  MAX_PROBLEMS,
  readNumber,
  rowProblem,
  type ParsedSweepFile,
  type ResolvedColumn,
} from './parse';

/** A converted point, ready to store. */
export interface ConvertedPoint {
  sourceRows: number[];
  /** Indexes into the parsed records of the rows this point was made from. */
  recordIndexes: number[];
  temperatureK: number;
  currentA: number | null;
  voltageV: number | null;
  resistanceOhm: number | null;
  sheetResistanceOhmSq: number | null;
  resistivityOhmCm: number;
  flags: PointFlag[];
}

/** Columns each method needs (any one of the alternatives). */
const REQUIRED: Record<SweepMethod, ColumnMeaning[][]> = {
  'four-point': [['temperature'], ['voltage', 'resistance']],
  bar: [['temperature'], ['voltage', 'resistance']],
  'van-der-pauw': [['temperature'], ['resistance'], ['resistance-b']],
  resistivity: [['temperature'], ['resistivity']],
  'sheet-resistance': [['temperature'], ['sheet-resistance']],
};

const FORWARD = /^(\+|\+1|1|f|fwd|forward|pos|positive|p|normal|\+i)$/i;
const REVERSE = /^(-|-1|r|rev|reverse|neg|negative|n|reversed|-i)$/i;

/** Names in physics error messages that point at geometry rather than at a row. */
const GEOMETRY_ARGS = /diameterCm|spacingCm|thicknessCm|lengthCm|widthCm/;

interface Reading {
  record: number;
  row: number;
  temperatureK: number;
  polarity: 1 | -1 | 0;
  voltageV: number | null;
  currentA: number | null;
  resistanceOhm: number | null;
  resistanceBOhm: number | null;
  sheetOhmSq: number | null;
  resistivityOhmCm: number | null;
}

/** Checks the mapping has what the method needs; throws a 400 naming what is missing. */
export function requireColumns(
  method: SweepMethod,
  columns: ResolvedColumn[],
  constantCurrentA: number | undefined,
): void {
  const has = new Set(columns.map((c) => c.meaning));
  const problems: Array<{ field: string; problem: string }> = [];
  for (const alternatives of REQUIRED[method]) {
    if (!alternatives.some((m) => has.has(m))) {
      problems.push({
        field: 'columns',
        problem: `a ${method} sweep needs a ${alternatives.join(' or ')} column; none was found or mapped`,
      });
    }
  }
  if (
    (method === 'four-point' || method === 'bar') &&
    has.has('voltage') &&
    !has.has('resistance')
  ) {
    if (!has.has('current') && constantCurrentA === undefined) {
      problems.push({
        field: 'columns',
        problem:
          'voltages need a current: map a current column or state the current in the file header',
      });
    }
  }
  for (const c of columns) {
    if (c.meaning !== 'other' && c.meaning !== 'index' && c.meaning !== 'polarity' && !c.unitInfo) {
      problems.push({
        field: `columns.${c.index}.unit`,
        problem: `the unit of "${c.header}" is not known`,
      });
    }
  }
  if (problems.length) throw validationFailed('The columns do not fit the method', problems);
}

/** The row being read: its cells, line number and whether a problem was found in it. */
interface CellContext {
  cells: string[];
  row: number;
  bad: boolean;
  mark: '.' | ',';
  problems: RowProblem[];
}

/** A cell as a number in stored units; null when empty (a problem when `required`). */
function readCell(ctx: CellContext, c: ResolvedColumn, required: boolean): number | null {
  const cell = ctx.cells[c.index] ?? '';
  const value = readNumber(cell, ctx.mark);
  if (value === undefined) {
    ctx.problems.push(rowProblem(ctx.row, c.header, `"${cell.trim()}" is not a number`));
    ctx.bad = true;
    return null;
  }
  if (value === null) {
    if (required) {
      ctx.problems.push(rowProblem(ctx.row, c.header, 'the value is missing'));
      ctx.bad = true;
    }
    return null;
  }
  return c.unitInfo!.factor === 1 ? value : value * c.unitInfo!.factor;
}

/** Reports a zero or negative resistance-like value; true when it did. */
function positiveOrReport(ctx: CellContext, c: ResolvedColumn | null, v: number | null): boolean {
  if (!c || v === null || v > 0) return false;
  ctx.problems.push(rowProblem(ctx.row, c.header, `the value must be above zero (${v})`));
  return true;
}

function friendly(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  return message.replace(/`[a-zA-Z]+` /, '');
}

/**
 * Converts rows to points a slice at a time, so that the caller can store one slice while the
 * next is converted. Row problems are collected (at most `MAX_PROBLEMS`) across all slices;
 * once there is one, no more points are given out and the caller must store nothing. A forward
 * or reverse reading at the end of a slice waits for the next slice's first reading, its
 * possible partner. Geometry that the physics refuses (a diameter under three probe spacings)
 * is a 400.
 */
export class RowConverter {
  /** Row problems found so far (at most `MAX_PROBLEMS`). */
  readonly problems: RowProblem[];
  private readonly unpaired: number[] = [];
  /** A reading with a polarity whose partner may open the next slice. */
  private held: Reading | null = null;
  private emitted = 0;
  private readonly read: (i: number) => Reading | null;
  private readonly convert: (f: Reading, r?: Reading) => ConvertedPoint | null;

  constructor(
    private readonly parsed: ParsedSweepFile,
    columns: ResolvedColumn[],
    method: SweepMethod,
    geometry: SweepGeometry,
    constantCurrentA: number | undefined,
  ) {
    this.problems = [...parsed.problems];
    this.read = readingReader(parsed, columns, method, geometry, constantCurrentA, this.problems);
    this.convert = pointMaker(method, geometry, this.problems, columns);
  }

  /** True while more problems may still be collected. */
  get open(): boolean {
    return this.problems.length < MAX_PROBLEMS;
  }

  /**
   * Converts records `start` to `end` (exclusive) and returns the points completed so far;
   * `more` tells whether records follow (read or not yet read).
   */
  next(
    start: number,
    end: number,
    more = end < this.parsed.table.records.length,
  ): ConvertedPoint[] {
    const readings: Reading[] = this.held ? [this.held] : [];
    this.held = null;
    for (let i = start; i < end && this.open; i++) {
      const reading = this.read(i);
      if (reading) readings.push(reading);
    }
    if (this.problems.length) return [];
    const last = readings[readings.length - 1];
    if (last && last.polarity !== 0 && more) {
      this.held = readings.pop()!;
    }
    return this.pointsOf(readings);
  }

  /** The points still held after the last slice, and the final check for an empty file. */
  finish(): ConvertedPoint[] {
    const rest = this.held && !this.problems.length ? this.pointsOf([this.held]) : [];
    this.held = null;
    if (this.problems.length === 0 && this.emitted === 0) {
      this.problems.push(rowProblem(null, null, 'the file holds no data rows'));
    }
    return rest;
  }

  /** The warnings about the conversion itself (polarity readings left unpaired). */
  get warnings(): string[] {
    return this.unpaired.length
      ? [
          `${this.unpaired.length} reading(s) with a polarity but no opposite-polarity partner were stored on their own (rows ${listRows(this.unpaired)})`,
        ]
      : [];
  }

  /** Neighbouring forward and reverse readings form a pair; everything else stands alone. */
  private pointsOf(readings: Reading[]): ConvertedPoint[] {
    const points: ConvertedPoint[] = [];
    for (let i = 0; i < readings.length && this.open; i++) {
      const a = readings[i]!;
      const b = readings[i + 1];
      const paired = a.polarity !== 0 && b !== undefined && b.polarity === -a.polarity;
      if (paired) i++;
      const point = paired
        ? a.polarity === 1
          ? this.convert(a, b)
          : this.convert(b, a)
        : this.convert(a);
      if (!point) continue;
      if (paired) point.flags.push('polarity-averaged');
      else if (a.polarity !== 0) {
        point.flags.push('unpaired-polarity');
        this.unpaired.push(a.row);
      }
      points.push(point);
    }
    if (this.problems.length) return [];
    this.emitted += points.length;
    return points;
  }
}

/**
 * A reader of one record as a reading in stored units; null after noting its problems (or for
 * a row left out). Problems go to `problems`.
 */
function readingReader(
  parsed: ParsedSweepFile,
  columns: ResolvedColumn[],
  method: SweepMethod,
  geometry: SweepGeometry,
  constantCurrentA: number | undefined,
  problems: RowProblem[],
): (i: number) => Reading | null {
  const mark = parsed.layout.decimalMark;
  const col = (m: ColumnMeaning) => columns.find((c) => c.meaning === m) ?? null;
  const tCol = col('temperature')!;
  const vCol = col('voltage');
  const iCol = col('current');
  const rCol = col('resistance');
  const rbCol = col('resistance-b');
  const sCol = col('sheet-resistance');
  const rhoCol = col('resistivity');
  const pCol = col('polarity');
  const tUnit = tCol.unitInfo!;
  const rtd = tUnit.kind === 'resistance';
  const { records, lines } = parsed.table;
  const ctx: CellContext = { cells: [], row: 0, bad: false, mark, problems };
  const num = (c: ResolvedColumn | null, required: boolean) =>
    c ? readCell(ctx, c, required) : null;
  const needVI = method === 'four-point' || method === 'bar';
  return (i) => {
    const cells = records[i]!;
    const row = lines[i]!;
    ctx.cells = cells;
    ctx.row = row;
    ctx.bad = false;
    const tRaw = num(tCol, true);
    let polarity: 1 | -1 | 0 = 0;
    if (pCol) {
      const text = (cells[pCol.index] ?? '').trim();
      if (FORWARD.test(text)) polarity = 1;
      else if (REVERSE.test(text)) polarity = -1;
      else {
        ctx.bad = true;
        problems.push(
          rowProblem(
            row,
            pCol.header,
            `polarity "${text}" is not understood (use + or -, forward or reverse)`,
          ),
        );
      }
    }
    const voltageV = num(vCol, needVI && !rCol);
    let currentA = iCol
      ? num(iCol, needVI && !rCol)
      : voltageV !== null
        ? (constantCurrentA ?? null)
        : null;
    const resistanceOhm = num(rCol, method === 'van-der-pauw' || (needVI && !vCol));
    const resistanceBOhm = num(rbCol, method === 'van-der-pauw');
    const sheetOhmSq = num(sCol, method === 'sheet-resistance');
    const resistivityOhmCm = num(rhoCol, method === 'resistivity');
    if (ctx.bad || tRaw === null) return null;

    let temperatureK: number;
    try {
      temperatureK =
        tUnit.label === 'degC'
          ? celsiusToKelvin(tRaw)
          : rtd
            ? rtdTemperatureK(tRaw, geometry.rtdR0Ohm)
            : tRaw;
    } catch (error) {
      problems.push(
        rowProblem(row, tCol.header, `the temperature cannot be converted: ${friendly(error)}`),
      );
      return null;
    }
    if (!(temperatureK > 0)) {
      problems.push(
        rowProblem(row, tCol.header, `the temperature is at or below 0 K (${temperatureK} K)`),
      );
      return null;
    }
    if (currentA !== null && iCol) {
      // A reverse reading may give the current as a magnitude; it flows the other way.
      if (polarity === -1 && currentA > 0) currentA = -currentA;
      const wrong = polarity === 0 ? currentA <= 0 : polarity === 1 ? currentA <= 0 : currentA >= 0;
      if (wrong) {
        problems.push(
          rowProblem(
            row,
            iCol.header,
            polarity === 0 && currentA < 0
              ? `the current is negative (${currentA} A); mark reverse-polarity readings in a polarity column`
              : `the current must not be zero or point the wrong way (${currentA} A)`,
          ),
        );
        return null;
      }
    }
    if (
      positiveOrReport(ctx, rCol, resistanceOhm) ||
      positiveOrReport(ctx, rbCol, resistanceBOhm) ||
      positiveOrReport(ctx, sCol, sheetOhmSq) ||
      positiveOrReport(ctx, rhoCol, resistivityOhmCm)
    ) {
      return null;
    }
    return {
      record: i,
      row,
      temperatureK,
      polarity,
      voltageV,
      currentA,
      resistanceOhm,
      resistanceBOhm,
      sheetOhmSq,
      resistivityOhmCm,
    };
  };
}

/** Row numbers for a warning, the first ten and a count of the rest. */
export function listRows(rows: number[]): string {
  const shown = rows.slice(0, 10).join(', ');
  return rows.length > 10 ? `${shown} and ${rows.length - 10} more` : shown;
}

/** Mean of a value of the forward and reverse readings (null if either lacks it). */
function pairMean(f: number | null, r: number | null): number | null {
  return f === null || r === null ? null : (f + r) / 2;
}

/**
 * A converter of one reading, or of a forward/reverse pair (forward first), to a point; null
 * after noting a row problem. The physics input object is reused from row to row.
 */
function pointMaker(
  method: SweepMethod,
  geometry: SweepGeometry,
  problems: RowProblem[],
  columns: ResolvedColumn[],
): (f: Reading, r?: Reading) => ConvertedPoint | null {
  const probeInput: Parameters<typeof fourPointProbe>[0] = {
    voltageV: 0,
    currentA: 0,
    spacingCm: geometry.spacingCm!,
    thicknessCm: geometry.thicknessCm!,
  };
  if (geometry.diameterCm !== undefined) probeInput.diameterCm = geometry.diameterCm;
  return (f, r) => toPoint(f, r, method, geometry, problems, columns, probeInput);
}

function toPoint(
  f: Reading,
  r: Reading | undefined,
  method: SweepMethod,
  geometry: SweepGeometry,
  problems: RowProblem[],
  columns: ResolvedColumn[],
  probeInput: Parameters<typeof fourPointProbe>[0],
): ConvertedPoint | null {
  // Forward/reverse average: V = (V+ - V-)/2 over I = (I+ - I-)/2 cancels thermal EMFs.
  const voltageV = r
    ? f.voltageV !== null && r.voltageV !== null
      ? (f.voltageV - r.voltageV) / 2
      : null
    : f.voltageV;
  const currentA = r
    ? f.currentA !== null && r.currentA !== null
      ? (f.currentA - r.currentA) / 2
      : null
    : f.currentA;
  const point: ConvertedPoint = {
    sourceRows: r ? [f.row, r.row] : [f.row],
    recordIndexes: r ? [f.record, r.record] : [f.record],
    temperatureK: r ? (f.temperatureK + r.temperatureK) / 2 : f.temperatureK,
    currentA,
    voltageV,
    resistanceOhm: r ? pairMean(f.resistanceOhm, r.resistanceOhm) : f.resistanceOhm,
    sheetResistanceOhmSq: r ? pairMean(f.sheetOhmSq, r.sheetOhmSq) : f.sheetOhmSq,
    resistivityOhmCm: 0,
    flags: [],
  };
  // Without V and I the file gives V/I as a resistance: pass it as V over a unit current.
  const hasVI = point.voltageV !== null && point.currentA !== null;
  const v = hasVI ? point.voltageV! : point.resistanceOhm!;
  const i = hasVI ? point.currentA! : 1;
  try {
    if (method === 'four-point') {
      probeInput.voltageV = v;
      probeInput.currentA = i;
      const out = fourPointProbe(probeInput);
      point.sheetResistanceOhmSq = out.sheetResistanceOhmSq;
      point.resistivityOhmCm = out.resistivityOhmCm;
    } else if (method === 'bar') {
      point.resistivityOhmCm = barResistivity({
        voltageV: v,
        currentA: i,
        lengthCm: geometry.barLengthCm!,
        widthCm: geometry.barWidthCm!,
        thicknessCm: geometry.thicknessCm!,
      });
    } else if (method === 'van-der-pauw') {
      const out = vanDerPauw({
        resistanceAOhm: point.resistanceOhm!,
        resistanceBOhm: (r ? pairMean(f.resistanceBOhm, r.resistanceBOhm) : f.resistanceBOhm)!,
        thicknessCm: geometry.thicknessCm!,
      });
      point.sheetResistanceOhmSq = out.sheetResistanceOhmSq;
      point.resistivityOhmCm = out.resistivityOhmCm!;
    } else if (method === 'resistivity') {
      point.resistivityOhmCm = (
        r ? pairMean(f.resistivityOhmCm, r.resistivityOhmCm) : f.resistivityOhmCm
      )!;
    } else {
      point.resistivityOhmCm = resistivityFromSheetResistance({
        sheetResistanceOhmSq: point.sheetResistanceOhmSq!,
        thicknessCm: geometry.thicknessCm!,
      });
    }
  } catch (error) {
    const message = friendly(error);
    if (GEOMETRY_ARGS.test(message)) {
      throw validationFailed('The geometry does not fit the method', [
        { field: 'geometry', problem: message },
      ]);
    }
    const column =
      columns.find((c) => c.meaning === 'voltage' || c.meaning === 'resistance')?.header ?? null;
    const opposite = /same sign/.test(message);
    problems.push(
      rowProblem(
        f.row,
        column,
        opposite
          ? 'voltage and current have opposite signs (a negative resistance); check the wiring or the polarity column'
          : `the resistivity cannot be computed: ${message}`,
      ),
    );
    return null;
  }
  return point;
}
