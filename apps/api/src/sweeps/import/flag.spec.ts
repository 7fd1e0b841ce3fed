import { describe, expect, it } from 'vitest';
import { JUMP_FACTOR } from '@rhotrace/api-types';
import { markPoints, SuspiciousPointFinder } from './flag';
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
    expect(summary.findings).toEqual([
      {
        sequence: 4,
        row: 5,
        flag: 'temperature-reversal',
        reason: 'the temperature steps 1.70 K down inside a leg running up',
      },
    ]);
    expect(summary.warnings).toEqual([
      'the temperature goes against the ramp at 1 point(s) (rows 5)',
    ]);
  });

  it('has no range without points', () => {
    expect(new SuspiciousPointFinder().finish()).toEqual({
      legs: [],
      late: {},
      findings: [],
      reversals: [],
      flagged: 0,
      warnings: [],
      minTemperatureK: null,
      maxTemperatureK: null,
    });
  });

  it('numbers the legs of an up-and-down ramp and keeps the return free of reversals', () => {
    const finder = new SuspiciousPointFinder();
    const temps = [300, 310, 320, 330, 340, 350, 340, 330, 320, 310, 300];
    finder.addAll(temps.map((t, i) => point(i + 2, t, Math.exp(-t / 100))));
    const summary = finder.finish();
    expect(summary.legs.map((l) => [l.start, l.end, l.direction])).toEqual([
      [0, 6, 'up'],
      [6, 11, 'down'],
    ]);
    expect(summary.reversals).toEqual([]);
    expect(summary.flagged).toBe(0);
  });

  it('flags a spike as an outlier with its reason, and a van der Pauw ratio above 3 warns', () => {
    const finder = new SuspiciousPointFinder();
    const points = Array.from({ length: 12 }, (_, i) => point(i + 2, 300 + 5 * i, 1 + 0.01 * i));
    points[6]!.resistivityOhmCm *= 1.3;
    points[3]!.resistanceRatio = 4.2;
    finder.addAll(points);
    const summary = finder.finish();
    expect(summary.late).toEqual({ outlier: [6] });
    expect(summary.findings[0]).toMatchObject({ sequence: 7, row: 8, flag: 'outlier' });
    expect(summary.findings[0]!.reason).toMatch(/\(\+\d+\.\d %\) in leg 1/);
    expect(summary.warnings.join(' ')).toMatch(/R_A\/R_B reaches 4\.20 \(above 3\) at 1 point/);
  });

  it('flags a long sweep whose every step drifts (130,000 findings once overflowed the stack)', () => {
    // 15,000 dwells of ten readings, each held at its temperature (steps 0.002 K apart, a
    // tolerance of 0.001 K) while rho still creeps 0.3 % one way: every reading is unsettled
    const n = 150_000;
    const points = Array.from({ length: n }, (_, i) => {
      const t = 80 + 0.002 * Math.floor(i / 10);
      return point(i + 2, t, 0.01 * (t / 300) ** 1.5 * (1 + 3e-4 * (i % 10)));
    });
    const finder = new SuspiciousPointFinder(0.001);
    finder.addAll(points);
    const summary = finder.finish();
    const unsettled = summary.late.unsettled ?? [];
    expect(unsettled.length).toBeGreaterThan(130_000);
    expect(unsettled.every((p, k) => k === 0 || p > unsettled[k - 1]!)).toBe(true);
    markPoints(points, summary);
    expect(points.filter((p) => p.flags.includes('unsettled'))).toHaveLength(unsettled.length);
    expect(new Set(points.map((p) => p.leg))).toEqual(new Set([1]));
  });
});
