import { describe, expect, it } from 'vitest';
import { JUMP_FACTOR } from '@rhotrace/api-types';
import { SuspiciousPointFinder } from './flag';
import type { ConvertedPoint } from './import-types';

const point = (row: number, temperatureK: number, resistivityOhmCm: number): ConvertedPoint => ({
  sourceRows: [row],
  recordIndexes: [row - 2],
  temperatureK,
  currentA: null,
  voltageV: null,
  resistanceOhm: null,
  sheetResistanceOhmSq: null,
  resistivityOhmCm,
  flags: [],
});

describe('flag', () => {
  it(`flags a jump of more than ${JUMP_FACTOR} times on the point itself, up and down`, () => {
    const finder = new SuspiciousPointFinder();
    const points = finder.addAll([
      point(2, 80, 1),
      point(3, 81, JUMP_FACTOR * 1.01),
      point(4, 82, 1),
      point(5, 83, JUMP_FACTOR * 0.99),
    ]);
    expect(points.map((p) => p.flags)).toEqual([[], ['jump'], ['jump'], []]);
    expect(finder.finish().warnings).toEqual([
      `2 point(s) differ from the previous one by more than ${JUMP_FACTOR} times in resistivity (rows 3, 4)`,
    ]);
  });

  it('names steps against the ramp beyond 0.5 K, not thermometer noise, and the range', () => {
    const finder = new SuspiciousPointFinder();
    finder.addAll([
      point(2, 80, 1),
      point(3, 81, 1),
      point(4, 80.7, 1),
      point(5, 79, 1),
      point(6, 90, 1),
    ]);
    const summary = finder.finish();
    expect(summary).toMatchObject({
      reversals: [3],
      flagged: 1,
      minTemperatureK: 79,
      maxTemperatureK: 90,
    });
    expect(summary.warnings).toEqual([
      'the temperature goes against the ramp at 1 point(s) (rows 5)',
    ]);
  });

  it('has no range without points', () => {
    expect(new SuspiciousPointFinder().finish()).toEqual({
      reversals: [],
      flagged: 0,
      warnings: [],
      minTemperatureK: null,
      maxTemperatureK: null,
    });
  });
});
