import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import {
  applyColumnOverrides,
  parseSweepFile,
  parseUnit,
  splitHeader,
  UnreadableFileError,
  unreadableCells,
} from './index';

const SEED = fileURLToPath(new URL('../../../../../seed-data/sweeps/', import.meta.url));
const fixtures = readdirSync(SEED).filter((f) => f.endsWith('.expected.json'));

interface Sidecar {
  file: string;
  expect: {
    delimiter: string;
    decimalMark: string;
    pointCount: number;
    headerRow: number;
    metadata?: Record<string, string>;
    columns: Array<{ index: number; meaning: string; unit: string | null }>;
    suggestedMethod: string;
  };
}

describe('parseSweepFile on every example export', () => {
  it('finds at least six shapes', () => expect(fixtures.length).toBeGreaterThanOrEqual(6));
  for (const name of fixtures) {
    it(`reads ${name.replace('.expected.json', '')} as its sidecar says`, () => {
      const sidecar = JSON.parse(readFileSync(SEED + name, 'utf8')) as Sidecar;
      const parsed = parseSweepFile(readFileSync(SEED + sidecar.file));
      const e = sidecar.expect;
      expect(parsed.layout.delimiter).toBe(e.delimiter);
      expect(parsed.layout.decimalMark).toBe(e.decimalMark);
      expect(parsed.layout.headerLine).toBe(e.headerRow);
      expect(parsed.layout.metadata).toMatchObject(e.metadata ?? {});
      expect(parsed.columns.map(({ index, meaning, unit }) => ({ index, meaning, unit }))).toEqual(
        e.columns,
      );
      expect(parsed.suggestedMethod).toBe(e.suggestedMethod);
      expect(parsed.problems).toEqual([]);
      expect(unreadableCells(parsed, parsed.columns)).toEqual([]);
    });
  }
});

describe('layout details', () => {
  it('keeps file line numbers across CRLF, blank and comment lines', () => {
    const text = 'T (K),V (mV),I (mA)\r\n\r\n300,1,1\r\n# pause\r\n310,1.1,1\r\n';
    const p = parseSweepFile(Buffer.from(text));
    expect(p.table.lines).toEqual([3, 5]);
    expect(p.table.records).toEqual([
      ['300', '1', '1'],
      ['310', '1.1', '1'],
    ]);
  });

  it('keeps line numbers when a quoted cell spans two lines', () => {
    const text = 'T (K),V (mV),note\n300,1,"two\nlines"\n310,2,x\n';
    const p = parseSweepFile(Buffer.from(text));
    expect(p.table.lines).toEqual([2, 4]);
    expect(p.table.records[0]![2]).toBe('two\nlines');
  });

  it('reads a units row under the header', () => {
    const p = parseSweepFile(Buffer.from('Temperature;Voltage;Current\nK;mV;uA\n300;1,5;10\n'));
    expect(p.layout.unitsLine).toBe(2);
    expect(p.columns.map((c) => [c.meaning, c.unit])).toEqual([
      ['temperature', 'K'],
      ['voltage', 'mV'],
      ['current', 'uA'],
    ]);
  });

  it('reports a row with the wrong number of cells by its line', () => {
    const p = parseSweepFile(Buffer.from('T (K),R (ohm)\n300,1\n310\n320,3\n'));
    expect(p.problems).toEqual([
      { row: 3, column: null, problem: 'expected 2 values, found 1', field: 'row 3' },
    ]);
  });

  it('names unreadable cells by row and column', () => {
    const p = parseSweepFile(Buffer.from('T (K),R (ohm)\n300,1\n310,OVER\n'));
    expect(unreadableCells(p, p.columns)).toEqual([
      {
        row: 3,
        column: 'R (ohm)',
        problem: '"OVER" is not a number',
        field: 'row 3, column R (ohm)',
      },
    ]);
  });

  it('refuses empty, blank, binary and shapeless files in plain words', () => {
    const refuse = (b: Buffer) => {
      try {
        parseSweepFile(b);
      } catch (e) {
        expect(e).toBeInstanceOf(UnreadableFileError);
        return (e as Error).message;
      }
      throw new Error('accepted');
    };
    expect(refuse(Buffer.alloc(0))).toMatch(/empty/);
    expect(refuse(Buffer.from(' \n\n '))).toMatch(/blank/);
    expect(refuse(Buffer.from([0x50, 0x4b, 0x03, 0x04, 0, 0, 1, 2]))).toMatch(/not a text export/);
    expect(refuse(Buffer.from('just some words\nand more words\n'))).toMatch(/No rows of numbers/);
  });
});

describe('units and headers', () => {
  it.each([
    ['T (°C)', 'T', 'degC', 1],
    ['Temp [K]', 'Temp', 'K', 1],
    ['R_kohm', 'R', 'kohm', 1e3],
    ['R [kΩ]', 'R', 'kohm', 1e3],
    ['R (MΩ)', 'R', 'Mohm', 1e6],
    ['R (mΩ)', 'R', 'mohm', 1e-3],
    ['V (mV)', 'V', 'mV', 1e-3],
    ['V (µV)', 'V', 'uV', 1e-6],
    ['I (µA)', 'I', 'uA', 1e-6],
    ['I_nA', 'I', 'nA', 1e-9],
    ['temperature_K', 'temperature', 'K', 1],
    ['voltage_mV', 'voltage', 'mV', 1e-3],
    ['resistivity_ohm_cm', 'resistivity', 'ohm_cm', 1],
    ['rho (Ω·cm)', 'rho', 'ohm_cm', 1],
    ['Rs (ohm/sq)', 'Rs', 'ohm/sq', 1],
    ['sheet_resistance_ohm_sq', 'sheet resistance', 'ohm/sq', 1],
    ['T / degC', 'T', 'degC', 1],
  ])('%s is %s in %s', (header, name, label, factor) => {
    const parts = splitHeader(header);
    expect(parts.name).toBe(name);
    expect(parts.unit?.label).toBe(label);
    expect(parts.unit?.factor).toBeCloseTo(factor, 15);
  });

  it('does not take an unknown unit for kelvin', () => {
    const p = parseSweepFile(Buffer.from('T (F),R (ohm)\n300,1\n'));
    expect(p.columns[0]).toMatchObject({ meaning: 'temperature', unit: null });
    expect(parseUnit('furlong')).toBeNull();
  });

  it('applies a mapping override and frees the meaning it takes', () => {
    const p = parseSweepFile(Buffer.from('T (K),V1 (mV),V2 (mV),I (mA)\n300,1,2,1\n'));
    const { columns, problems } = applyColumnOverrides(p.columns, [
      { index: 2, meaning: 'voltage', unit: 'uV' },
    ]);
    expect(problems).toEqual([]);
    expect(columns[1]!.meaning).toBe('other');
    expect(columns[2]).toMatchObject({ meaning: 'voltage', unit: 'uV', confidence: 1 });
    const bad = applyColumnOverrides(p.columns, [
      { index: 9, meaning: 'voltage' },
      { index: 0, meaning: 'temperature', unit: 'mA' },
    ]);
    expect(bad.problems.map((x) => x.field)).toEqual(['columns.0.index', 'columns.1.unit']);
  });
});
