import { describe, expect, it } from 'vitest';
import { reciprocityDifference } from './reciprocity';
import { vanDerPauw } from './van-der-pauw';

/**
 * Four-terminal resistance of a half-plane sheet with point contacts on its edge at positions
 * `x` (cm): current in at `a`, out at `b`, voltage `c` minus `d`. A current I entering the edge
 * of a sheet of R_s sets the potential -(R_s I / pi) ln r (van der Pauw 1958, the half-plane
 * from which his theorem is conformally mapped).
 */
function halfPlaneOhm(
  rsOhmSq: number,
  x: Record<string, number>,
  [a, b, c, d]: [string, string, string, string],
) {
  const v = (at: string) =>
    (-rsOhmSq / Math.PI) *
    (Math.log(Math.abs(x[at]! - x[a]!)) - Math.log(Math.abs(x[at]! - x[b]!)));
  return v(c) - v(d);
}

describe('reciprocityDifference', () => {
  it('is zero for the reciprocal readings of a half-plane, whose R_A and R_B solve van der Pauw', () => {
    // Van der Pauw 1958: R_AB,CD = R_CD,AB (reciprocity) and exp(-pi R_A/R_s) + exp(-pi R_B/R_s)
    // = 1 on a half-plane with contacts A, B, C, D in order along its edge. Tolerance 1e-12.
    const rs = 120;
    const x = { A: 0, B: 0.7, C: 1.9, D: 2.6 };
    const ra = halfPlaneOhm(rs, x, ['A', 'B', 'D', 'C']);
    const raReciprocal = halfPlaneOhm(rs, x, ['D', 'C', 'A', 'B']);
    const rb = halfPlaneOhm(rs, x, ['B', 'C', 'A', 'D']);
    const rbReciprocal = halfPlaneOhm(rs, x, ['A', 'D', 'B', 'C']);
    expect(ra).toBeGreaterThan(0);
    expect(rb).toBeGreaterThan(0);
    expect(reciprocityDifference(ra, raReciprocal)).toBeLessThan(1e-12);
    expect(reciprocityDifference(rb, rbReciprocal)).toBeLessThan(1e-12);
    const solved = vanDerPauw({ resistanceAOhm: ra, resistanceBOhm: rb }).sheetResistanceOhmSq;
    expect(Math.abs(solved / rs - 1)).toBeLessThan(1e-12);
  });

  it('gives the difference over the mean: 100 and 103 ohm are 2.96 % apart', () => {
    // Worked by hand: 3 / 101.5 = 0.0295567 (common practice, no source: difference over mean).
    expect(reciprocityDifference(100, 103)).toBeCloseTo(0.0295567, 6);
    expect(reciprocityDifference(103, 100)).toBe(reciprocityDifference(100, 103));
  });

  it('refuses a reading at or below zero, naming it', () => {
    expect(() => reciprocityDifference(100, 0)).toThrow(/reciprocalOhm/);
    expect(() => reciprocityDifference(-1, 100)).toThrow(/resistanceOhm/);
  });
});
