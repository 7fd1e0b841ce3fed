/**
 * Stage 3, read a row: its cells as numbers in stored units (kelvin, volts, amperes, ohms,
 * ohm cm), its polarity, and the checks one row allows on its own. Problems are collected per
 * row and column; a row with one gives no reading.
 */
import type { ColumnMeaning, RowProblem, SweepGeometry, SweepMethod } from '@rhotrace/api-types';
import { PhysicsInputError } from '@rhotrace/physics';
import {
  readNumber,
  rowProblem,
  type DecimalMark,
  type ParsedSweepFile,
  type ResolvedColumn,
} from '../parse';
import type { Reading, RowSite } from './import-types';
import { hallColumns, type HallMeaning, type HallReadingKey } from './hall-cells';
import { POINT_METHODS } from './methods';
import { polarityOf, signCurrent } from './polarity-cells';
import { readSiteCells, type SiteColumns } from './site-cells';
import { temperatureReader, type TemperatureReader } from './temperature';

/** Columns a reading may use, by meaning (null when not mapped). */
type ColumnsByMeaning = Record<
  | 'voltage'
  | 'current'
  | 'resistance'
  | 'resistance-b'
  | 'sheet-resistance'
  | 'resistivity'
  | 'resistance-reciprocal'
  | 'resistance-b-reciprocal'
  | HallMeaning,
  ResolvedColumn | null
>;

/** The Hall part of a reading from a file without Hall columns. */
const NO_HALL: Required<Pick<Reading, HallReadingKey>> = Object.freeze({
  magneticFieldT: null,
  hallVoltageV: null,
  hallReversalsV: null,
});

/** Reads records of a parsed file as readings; problems go to the list it is given. */
export class RowReader {
  private readonly temperature: ResolvedColumn;
  private readonly referenceJunction: ResolvedColumn | null;
  private readonly toKelvin: TemperatureReader['toKelvin'];
  private readonly polarity: ResolvedColumn | null;
  private readonly columns: ColumnsByMeaning;
  /** Whether each column's cell must be filled. */
  private readonly required: Record<keyof ColumnsByMeaning, boolean>;
  private readonly mark: DecimalMark;
  private readonly site: SiteColumns;
  /** True while the row being read has a problem. */
  private bad = false;
  private readonly currentFromHeader: boolean;
  /** Whether any Hall column is mapped (most files have none: their rows skip the Hall cells). */
  private readonly hasHall: boolean;

  constructor(
    private readonly parsed: ParsedSweepFile,
    columns: ResolvedColumn[],
    method: SweepMethod,
    private readonly geometry: SweepGeometry,
    private readonly constantCurrentA: number | undefined,
    private readonly problems: RowProblem[],
    temperature?: TemperatureReader,
  ) {
    const col = (m: ColumnMeaning) => columns.find((c) => c.meaning === m) ?? null;
    this.temperature = col('temperature')!;
    this.referenceJunction = col('reference-junction');
    this.toKelvin = (
      temperature ??
      temperatureReader({
        column: this.temperature,
        referenceColumn: this.referenceJunction !== null,
        sensor: null,
        file: parsed.recognised,
        geometry,
      })
    ).toKelvin;
    this.polarity = col('polarity');
    this.columns = {
      voltage: col('voltage'),
      current: col('current'),
      resistance: col('resistance'),
      'resistance-b': col('resistance-b'),
      'sheet-resistance': col('sheet-resistance'),
      resistivity: col('resistivity'),
      'resistance-reciprocal': col('resistance-reciprocal'),
      'resistance-b-reciprocal': col('resistance-b-reciprocal'),
      ...hallColumns(col),
    };
    const entry = POINT_METHODS[method];
    const cells = new Set(entry.requiredCells);
    // V and I give the reading unless the file has V/I as a resistance column, and vice versa.
    const vi = entry.readsVoltageOverCurrent;
    const { voltage, resistance } = this.columns;
    this.required = {
      voltage: vi && !resistance,
      current: (vi && !resistance) || cells.has('current'),
      resistance: cells.has('resistance') || (vi && !voltage),
      'resistance-b': cells.has('resistance-b'),
      'sheet-resistance': cells.has('sheet-resistance'),
      resistivity: cells.has('resistivity'),
      'resistance-reciprocal': false,
      'resistance-b-reciprocal': false,
      ...hallColumns((m) => cells.has(m)),
    };
    this.hasHall = Object.values(hallColumns(col)).some((c) => c !== null);
    // A method that needs a current takes the file header's when no column gives one.
    this.currentFromHeader = cells.has('current');
    this.mark = parsed.layout.decimalMark;
    this.site = {
      x: col('site-x'),
      y: col('site-y'),
      number: col('site'),
      label: col('site-label'),
    };
  }

  /** Record `i` as a reading, or null after noting its problems. */
  read(i: number): Reading | null {
    const cells = this.parsed.table.records[i]!;
    const row = this.parsed.table.lines[i]!;
    this.bad = false;
    const temperatureRaw = this.cell(cells, row, this.temperature, true);
    const junction = this.referenceJunction;
    const junctionRaw = junction ? this.cell(cells, row, junction, true) : null;
    const polarity = this.readPolarity(cells, row);
    const voltageV = this.value(cells, row, 'voltage');
    let currentA = this.columns.current
      ? this.value(cells, row, 'current')
      : voltageV !== null || this.currentFromHeader
        ? (this.constantCurrentA ?? null)
        : null;
    const resistanceOhm = this.value(cells, row, 'resistance');
    const resistanceBOhm = this.value(cells, row, 'resistance-b');
    const sheetResistanceOhmSq = this.value(cells, row, 'sheet-resistance');
    const resistivityOhmCm = this.value(cells, row, 'resistivity');
    const resistanceReciprocalOhm = this.value(cells, row, 'resistance-reciprocal');
    const resistanceBReciprocalOhm = this.value(cells, row, 'resistance-b-reciprocal');
    const site = this.readSite(cells, row);
    const hall = this.readHall(cells, row);
    if (this.bad || temperatureRaw === null) return null;

    const celsius = junction?.unitInfo?.label === 'degC';
    const junctionK = junctionRaw === null ? null : junctionRaw + (celsius ? 273.15 : 0);
    const temperatureK = this.kelvin(temperatureRaw, junctionK, row);
    if (temperatureK === null) return null;
    if (currentA !== null && this.columns.current) {
      currentA = this.signedCurrent(currentA, polarity, row);
      if (currentA === null) return null;
    }
    if (
      this.notPositive(row, 'resistance', resistanceOhm) ||
      this.notPositive(row, 'resistance-b', resistanceBOhm) ||
      this.notPositive(row, 'resistance-reciprocal', resistanceReciprocalOhm) ||
      this.notPositive(row, 'resistance-b-reciprocal', resistanceBReciprocalOhm) ||
      this.notPositive(row, 'sheet-resistance', sheetResistanceOhmSq) ||
      this.notPositive(row, 'resistivity', resistivityOhmCm) ||
      this.notPositive(row, 'magnetic-field', hall.magneticFieldT)
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
      sheetResistanceOhmSq,
      resistivityOhmCm,
      resistanceReciprocalOhm,
      resistanceBReciprocalOhm,
      site,
      ...hall,
    };
  }

  /** A Hall sweep's field and voltages (all null when the file has no such columns). */
  private readHall(cells: string[], row: number): Required<Pick<Reading, HallReadingKey>> {
    if (!this.hasHall) return NO_HALL;
    const v = (m: HallMeaning) => this.value(cells, row, m);
    const [pp, pn, np, nn] = [
      v('hall-voltage-pp'),
      v('hall-voltage-pn'),
      v('hall-voltage-np'),
      v('hall-voltage-nn'),
    ];
    return {
      magneticFieldT: v('magnetic-field'),
      hallVoltageV: v('hall-voltage'),
      hallReversalsV:
        pp !== null && pn !== null && np !== null && nn !== null ? { pp, pn, np, nn } : null,
    };
  }

  /** The row's site (see `readSiteCells`); null for a file without sites or after a problem. */
  private readSite(cells: string[], row: number): RowSite | null {
    const site = readSiteCells(cells, this.site, (c) => this.cell(cells, row, c, true));
    if (site === null || !('problem' in site)) return site;
    this.problems.push(rowProblem(row, this.site.number!.header, site.problem));
    this.bad = true;
    return null;
  }

  /** Notes a zero or negative resistance-like value; true when it did. */
  private notPositive(row: number, meaning: keyof ColumnsByMeaning, value: number | null): boolean {
    const c = this.columns[meaning];
    if (!c || value === null || value > 0) return false;
    this.problems.push(rowProblem(row, c.header, `the value must be above zero (${value})`));
    return true;
  }

  private value(cells: string[], row: number, meaning: keyof ColumnsByMeaning): number | null {
    const c = this.columns[meaning];
    return c ? this.cell(cells, row, c, this.required[meaning]) : null;
  }

  /** A cell as a number in stored units; null when empty (a problem when `required`). */
  private cell(cells: string[], row: number, c: ResolvedColumn, required: boolean): number | null {
    const cell = cells[c.index] ?? '';
    const value = readNumber(cell, this.mark);
    if (value === undefined) {
      this.problems.push(rowProblem(row, c.header, `"${cell.trim()}" is not a number`));
      this.bad = true;
      return null;
    }
    if (value === null) {
      if (required) {
        this.problems.push(rowProblem(row, c.header, 'the value is missing'));
        this.bad = true;
      }
      return null;
    }
    const factor = c.unitInfo?.factor ?? 1;
    return factor === 1 ? value : value * factor;
  }

  private readPolarity(cells: string[], row: number): 1 | -1 | 0 {
    const c = this.polarity;
    if (!c) return 0;
    const text = (cells[c.index] ?? '').trim();
    const sign = polarityOf(text);
    if (sign !== null) return sign;
    this.bad = true;
    this.problems.push(
      rowProblem(
        row,
        c.header,
        `polarity "${text}" is not understood (use + or -, forward or reverse)`,
      ),
    );
    return 0;
  }

  /** The temperature in kelvin (through the sweep's temperature reader); null after a problem. */
  private kelvin(raw: number, junctionK: number | null, row: number): number | null {
    const c = this.temperature;
    let temperatureK: number;
    try {
      temperatureK = this.toKelvin(raw, junctionK);
    } catch (error) {
      if (!(error instanceof PhysicsInputError)) throw error;
      this.problems.push(
        rowProblem(row, c.header, `the temperature cannot be converted: ${error.requirement}`),
      );
      return null;
    }
    if (!(temperatureK > 0)) {
      this.problems.push(
        rowProblem(row, c.header, `the temperature is at or below 0 K (${temperatureK} K)`),
      );
      return null;
    }
    return temperatureK;
  }

  /** The current with the sign its polarity gives it; null after a problem. */
  private signedCurrent(currentA: number, polarity: 1 | -1 | 0, row: number): number | null {
    const signed = signCurrent(currentA, polarity);
    if (typeof signed === 'number') return signed;
    this.problems.push(rowProblem(row, this.columns.current!.header, signed.problem));
    return null;
  }
}
