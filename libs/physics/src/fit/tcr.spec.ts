import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { seededNormal, seededRandom } from '../numeric/prng';
import { fitLinearTcr } from './tcr';

const copper = (t: number): number => 1.68e-6 * (1 + 0.0039 * (t - 293.15));

describe('fitLinearTcr', () => {
  it('recovers the copper table values from an exact line', () => {
    // Introductory physics tables (e.g. Serway): Cu 1.68e-8 ohm m, alpha 0.0039 /K at 20 °C.
    const pts = [250, 275, 300, 325, 350].map((t) => ({
      temperatureK: t,
      resistivityOhmCm: copper(t),
    }));
    const r = fitLinearTcr(pts);
    expect(r.referenceResistivityOhmCm / 1.68e-6).toBeCloseTo(1, 10);
    expect(r.alphaPerK).toBeCloseTo(0.0039, 10);
    expect(r.rSquared).toBeCloseTo(1, 10);
  });

  it('re-references alpha to another temperature', () => {
    const pts = [250, 300, 350].map((t) => ({ temperatureK: t, resistivityOhmCm: copper(t) }));
    const r = fitLinearTcr(pts, 273.15);
    // alpha(T0) = alpha20 / (1 + alpha20 (T0 - 293.15)): common practice, no source.
    expect(r.alphaPerK).toBeCloseTo(0.0039 / (1 - 0.0039 * 20), 10);
  });

  it('agrees with simple-statistics and gives an interval holding the truth', () => {
    const n = seededNormal(seededRandom(4));
    const pts = Array.from({ length: 30 }, (_, i) => {
      const t = 250 + 5 * i;
      return { temperatureK: t, resistivityOhmCm: copper(t) * (1 + 0.002 * n()) };
    });
    const r = fitLinearTcr(pts);
    const ref = linearRegression(pts.map((p) => [p.temperatureK - 293.15, p.resistivityOhmCm]));
    expect(r.alphaPerK / (ref.m / ref.b)).toBeCloseTo(1, 9);
    expect(r.standardErrorAlpha).toBeGreaterThan(0);
    expect(r.ci95AlphaPerK[0]).toBeLessThan(0.0039);
    expect(r.ci95AlphaPerK[1]).toBeGreaterThan(0.0039);
  });
});

describe('fitLinearTcr invalid inputs', () => {
  it('rejects bad points and reference temperatures', () => {
    const pts = [250, 300, 350].map((t) => ({ temperatureK: t, resistivityOhmCm: copper(t) }));
    expect(() => fitLinearTcr(pts.slice(0, 2))).toThrow(/`fitLinearTcr`.*points/);
    expect(() => fitLinearTcr(pts, 0)).toThrow(/referenceK/);
    expect(() => fitLinearTcr([pts[0]!, pts[0]!, pts[0]!])).toThrow(/distinct/);
    expect(() => fitLinearTcr([...pts, { temperatureK: 300, resistivityOhmCm: -1 }])).toThrow(
      RangeError,
    );
  });
});
