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
    expect(r.parameters.referenceResistivityOhmCm / 1.68e-6).toBeCloseTo(1, 10);
    expect(r.parameters.alphaPerK).toBeCloseTo(0.0039, 10);
    expect(r.rSquared).toBeCloseTo(1, 10);
  });

  it('re-references alpha to another temperature', () => {
    const pts = [250, 300, 350].map((t) => ({ temperatureK: t, resistivityOhmCm: copper(t) }));
    const r = fitLinearTcr(pts, 273.15);
    // alpha(T0) = alpha20 / (1 + alpha20 (T0 - 293.15)): common practice, no source.
    expect(r.parameters.alphaPerK).toBeCloseTo(0.0039 / (1 - 0.0039 * 20), 10);
  });

  it('agrees with simple-statistics and gives an interval holding the truth', () => {
    const n = seededNormal(seededRandom(4));
    const pts = Array.from({ length: 30 }, (_, i) => {
      const t = 250 + 5 * i;
      return { temperatureK: t, resistivityOhmCm: copper(t) * (1 + 0.002 * n()) };
    });
    const r = fitLinearTcr(pts);
    const ref = linearRegression(pts.map((p) => [p.temperatureK - 293.15, p.resistivityOhmCm]));
    expect(r.parameters.alphaPerK / (ref.m / ref.b)).toBeCloseTo(1, 9);
    expect(r.standardErrors.alphaPerK!).toBeGreaterThan(0);
    expect(r.confidenceIntervals95.alphaPerK![0]).toBeLessThan(0.0039);
    expect(r.confidenceIntervals95.alphaPerK![1]).toBeGreaterThan(0.0039);
  });
});

describe('fitLinearTcr invalid inputs', () => {
  it('gives each point its residual ln(observed / fitted line), in input order', () => {
    // An exact line with one point lifted 2 %: least squares spreads the lift over all points,
    // so the check is against the fitted line from simple-statistics, computed independently.
    const temps = [350, 250, 300, 275, 325];
    const pts = temps.map((t, i) => ({
      temperatureK: t,
      resistivityOhmCm: copper(t) * (i === 2 ? 1.02 : 1),
    }));
    const r = fitLinearTcr(pts);
    const ref = linearRegression(pts.map((p) => [p.temperatureK - 293.15, p.resistivityOhmCm]));
    const expected = pts.map((p) =>
      Math.log(p.resistivityOhmCm / (ref.b + ref.m * (p.temperatureK - 293.15))),
    );
    expect(r.residuals).toHaveLength(5);
    r.residuals.forEach((v, i) => expect(v).toBeCloseTo(expected[i]!, 12));
    expect(r.residuals[2]).toBeGreaterThan(0.01);
    // exact data: every residual is zero
    const exact = fitLinearTcr(
      temps.map((t) => ({ temperatureK: t, resistivityOhmCm: copper(t) })),
    );
    exact.residuals.forEach((v) => expect(Math.abs(v)).toBeLessThan(1e-12));
  });

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
