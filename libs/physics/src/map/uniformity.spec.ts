import { describe, expect, it } from 'vitest';
import { mapUniformity } from './uniformity';

describe('mapUniformity', () => {
  it('matches a hand computation of five sites', () => {
    // Hand computation (sample standard deviation, range (max - min) / (max + min), as SEMI
    // MF81 / MF84 report uniformity): values 10, 11, 12, 11, 11 at r = 0, 50, 50, 50, 50 mm.
    // mean 11; deviations -1, 0, 1, 0, 0 -> ss 2, s = sqrt(2 / 4) = 0.70711, 6.4282 %;
    // range (12 - 10) / 22 = 9.0909 %; slope: r mean 40, sxx = 1600 + 4 * 100 = 2000,
    // sxy = (-40)(-1) + 10 (0 + 1 + 0 + 0) = 50, b = 0.025 per mm -> 0.22727 % per mm.
    const out = mapUniformity([
      { xMm: 0, yMm: 0, value: 10 },
      { xMm: 50, yMm: 0, value: 11 },
      { xMm: 0, yMm: 50, value: 12 },
      { xMm: -50, yMm: 0, value: 11 },
      { xMm: 0, yMm: -50, value: 11 },
    ]);
    expect(out.count).toBe(5);
    expect(out.mean).toBeCloseTo(11, 12);
    expect(out.stdDev).toBeCloseTo(Math.sqrt(0.5), 12);
    expect(out.stdDevPercent).toBeCloseTo(6.42824346533225, 9);
    expect(out.rangePercent).toBeCloseTo(9.0909090909, 8);
    expect(out.radialSlopePercentPerMm).toBeCloseTo(0.22727272727, 9);
  });

  it('leaves the spread and slope undefined where they are', () => {
    const one = mapUniformity([{ xMm: 3, yMm: 4, value: 2 }]);
    expect(one.stdDev).toBeNull();
    expect(one.radialSlopePercentPerMm).toBeNull();
    expect(one.rangePercent).toBe(0);
  });

  it('refuses no sites and a value that is not positive, naming the site', () => {
    expect(() => mapUniformity([])).toThrow(/`mapUniformity`.*sites/);
    expect(() =>
      mapUniformity([
        { xMm: 0, yMm: 0, value: 1 },
        { xMm: 0, yMm: 0, value: -1 },
      ]),
    ).toThrow(/sites\[1\]\.value/);
  });
});
