import { describe, expect, it } from 'vitest';
import type { RowProblem, SweepGeometry, SweepMethod } from '@rhotrace/api-types';
import { parseSweepFile } from '../parse';
import { RowReader } from './read-row';

/** Reads every record of `text` as `method`; returns the readings and the problems. */
function readAll(
  text: string,
  method: SweepMethod = 'four-point',
  geometry: SweepGeometry = { sources: {} },
) {
  const parsed = parseSweepFile(Buffer.from(text));
  const problems: RowProblem[] = [];
  const reader = new RowReader(
    parsed,
    parsed.columns,
    method,
    geometry,
    parsed.recognised.currentA,
    problems,
  );
  const readings = parsed.table.records.map((_, i) => reader.read(i));
  return { readings, problems: problems.map((p) => `${p.field}: ${p.problem}`) };
}

describe('read a row', () => {
  it('reads cells in stored units: °C to K, mV to V, mA to A', () => {
    // 23 °C = 296.15 K: the kelvin is defined so that T/K = t/°C + 273.15 (SI Brochure, 9th ed.).
    const { readings, problems } = readAll('T (°C),V (mV),I (mA)\n23,1.5,2\n');
    expect(problems).toEqual([]);
    expect(readings[0]).toMatchObject({ row: 2, polarity: 0, resistanceOhm: null });
    expect(readings[0]!.temperatureK).toBeCloseTo(296.15, 12);
    expect(readings[0]!.voltageV).toBeCloseTo(1.5e-3, 15);
    expect(readings[0]!.currentA).toBeCloseTo(2e-3, 15);
  });

  it('converts an RTD reading with the station R0', () => {
    // IEC 60751:2008 table: a Pt100 reads 138.5055 ohm at 100 °C (373.15 K).
    const { readings } = readAll('RTD (ohm),V (mV),I (mA)\n138.5055,1.5,1\n', 'four-point', {
      sources: {},
      rtdR0Ohm: 100,
    });
    expect(readings[0]!.temperatureK).toBeCloseTo(373.15, 3);
  });

  it('names an RTD reading outside the standard without the function name', () => {
    const { readings, problems } = readAll('RTD (ohm),V (mV),I (mA)\n5,1.5,1\n', 'four-point', {
      sources: {},
      rtdR0Ohm: 100,
    });
    expect(readings).toEqual([null]);
    expect(problems).toEqual([
      'row 2, column RTD (ohm): the temperature cannot be converted: requires a resistance (resistanceOhm) between 18.52008 and 390.4811 ohm for R0 = 100 ohm, got 5',
    ]);
  });

  it('turns the current of a reverse reading given as a magnitude around', () => {
    const { readings } = readAll('T (K),V (mV),I (mA),polarity\n300,1.5,1,+\n300,-1.5,1,-\n');
    expect(readings.map((r) => [r!.polarity, r!.currentA])).toEqual([
      [1, 1e-3],
      [-1, -1e-3],
    ]);
  });

  it('refuses a negative current without a polarity column, an unknown polarity, a missing value', () => {
    expect(readAll('T (K),V (mV),I (mA)\n300,1.5,-1\n').problems).toEqual([
      'row 2, column I (mA): the current is negative (-0.001 A); mark reverse-polarity readings in a polarity column',
    ]);
    expect(readAll('T (K),V (mV),I (mA),polarity\n300,1.5,1,sideways\n').problems).toEqual([
      'row 2, column polarity: polarity "sideways" is not understood (use + or -, forward or reverse)',
    ]);
    expect(readAll('T (K),V (mV),I (mA)\n300,,1\n310,1.6,1\n').problems).toEqual([
      'row 2, column V (mV): the value is missing',
    ]);
  });

  it('requires both resistances of a van der Pauw row, each above zero', () => {
    const { readings, problems } = readAll(
      'T (K),R_A (ohm),R_B (ohm)\n300,10,\n310,0,10\n320,10,12\n',
      'van-der-pauw',
    );
    expect(problems).toEqual([
      'row 2, column R_B (ohm): the value is missing',
      'row 3, column R_A (ohm): the value must be above zero (0)',
    ]);
    expect(readings[2]).toMatchObject({ resistanceOhm: 10, resistanceBOhm: 12 });
  });
});
