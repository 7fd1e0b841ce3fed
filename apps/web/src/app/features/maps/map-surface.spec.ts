import type { MapSiteDto } from '@rhotrace/api-types';
import { inverseDistanceValue, surfaceCells } from './map-surface';

const site = (xMm: number, yMm: number, value: number, excluded = false): MapSiteDto => ({
  xMm,
  yMm,
  label: null,
  sheetResistanceOhmSq: null,
  resistivityOhmCm: value,
  edgeFactor: 1,
  excluded,
  readingCount: 1,
});

describe('the interpolated map surface', () => {
  it('weights sites by the inverse square of distance', () => {
    // Shepard 1968, power 2, by hand: at (0, 0) with 10 at distance 1 and 20 at distance 2:
    // (10 / 1 + 20 / 4) / (1 / 1 + 1 / 4) = 15 / 1.25 = 12.
    const sites = [
      { xMm: 1, yMm: 0, value: 10 },
      { xMm: 0, yMm: 2, value: 20 },
    ];
    expect(inverseDistanceValue(0, 0, sites)).toBeCloseTo(12, 12);
    expect(inverseDistanceValue(1, 0, sites)).toBe(10);
  });

  it('covers the usable disc only, leaves excluded sites out and stays within the range', () => {
    const cells = surfaceCells(
      [site(0, 0, 10), site(20, 0, 12), site(-20, 0, 11), site(44, 0, 99, true)],
      40,
      20,
      { min: 10, max: 12 },
    );
    expect(cells.length).toBeGreaterThan(200);
    expect(cells.length).toBeLessThan(400);
    for (const c of cells) {
      expect(
        Math.hypot(Math.abs(c.xMm) - c.sizeMm / 2, Math.abs(c.yMm) - c.sizeMm / 2),
      ).toBeLessThanOrEqual(40);
      expect(c.value).toBeGreaterThanOrEqual(10);
      expect(c.value).toBeLessThanOrEqual(12);
    }
    expect(surfaceCells([site(0, 0, 1, true)], 40, 20, { min: 0, max: 2 })).toEqual([]);
  });
});
