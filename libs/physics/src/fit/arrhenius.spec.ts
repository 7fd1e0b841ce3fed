import fc from 'fast-check';
import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '../constants';
import { seededNormal, seededRandom } from '../numeric/prng';
import { studentTCritical } from '../numeric/student-t';
import { fitArrhenius } from './arrhenius';

const k = BOLTZMANN_EV_PER_K;
const sweep = (
  ea: number,
  temps: number[],
  noise = 0,
  seed = 1,
): Array<{ temperatureK: number; value: number }> => {
  const n = seededNormal(seededRandom(seed));
  return temps.map((t) => ({
    temperatureK: t,
    value: 1e-3 * Math.exp(ea / (k * t) + noise * n()),
  }));
};
const range = (a: number, b: number, count: number): number[] =>
  Array.from({ length: count }, (_, i) => a + ((b - a) * i) / (count - 1));

describe('studentTCritical', () => {
  it('matches the t table', () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.2, upper 0.975 critical values:
    // 1 -> 12.706, 2 -> 4.303, 5 -> 2.571, 10 -> 2.228, 30 -> 2.042, 100 -> 1.984. Tolerance 1e-3.
    const table: Array<[number, number]> = [
      [1, 12.706],
      [2, 4.303],
      [5, 2.571],
      [10, 2.228],
      [30, 2.042],
      [100, 1.984],
    ];
    for (const [dof, t] of table)
      expect(Math.abs(studentTCritical(0.95, dof) - t)).toBeLessThan(1e-3);
  });
});

describe('fitArrhenius', () => {
  it('recovers an exact activation energy for resistivity and conductivity', () => {
    const pts = sweep(0.56, range(300, 500, 12));
    const r = fitArrhenius(pts);
    expect(r.parameters.activationEnergyEv).toBeCloseTo(0.56, 10);
    expect(r.rSquared).toBeCloseTo(1, 12);
    expect(r.parameters.intercept).toBeCloseTo(Math.log(1e-3), 8);
    const c = fitArrhenius(
      pts.map((p) => ({ temperatureK: p.temperatureK, value: 1 / p.value })),
      { quantity: 'conductivity' },
    );
    expect(c.parameters.activationEnergyEv).toBeCloseTo(0.56, 10);
  });

  it('removes a T^m prefactor', () => {
    const pts = range(300, 600, 10).map((t) => ({
      temperatureK: t,
      value: Math.pow(t, -1.5) * Math.exp(0.3 / (k * t)),
    }));
    expect(fitArrhenius(pts, { prefactorExponent: 1.5 }).parameters.activationEnergyEv).toBeCloseTo(
      0.3,
      10,
    );
    expect(Math.abs(fitArrhenius(pts).parameters.activationEnergyEv - 0.3)).toBeGreaterThan(0.01);
  });

  it('agrees with simple-statistics linearRegression as an independent reference', () => {
    const pts = sweep(0.2, range(100, 400, 40), 0.05, 9);
    const r = fitArrhenius(pts, { prefactorExponent: 0.5 });
    const ref = linearRegression(
      pts.map((p) => [1 / (k * p.temperatureK), Math.log(p.value * Math.sqrt(p.temperatureK))]),
    );
    expect(r.parameters.activationEnergyEv / ref.m).toBeCloseTo(1, 10);
    expect(r.parameters.intercept).toBeCloseTo(ref.b, 8);
  });

  it('keeps 1e-9 agreement with linearRegression and the OLS standard error on 10,000 steps', () => {
    // simple-statistics linearRegression (independent); se(b) = sqrt(s^2 / Sxx), s^2 = SSR /
    // (n - 2) (Press et al., Numerical Recipes, 3rd ed., section 15.2). stepToleranceK 0 makes
    // every reading a step of weight 1, so the fit is ordinary least squares.
    const pts = sweep(0.55, range(300, 600, 10_000), 0.01, 2024);
    const r = fitArrhenius(pts, { stepToleranceK: 0 });
    const xy = pts.map((p) => [1 / (k * p.temperatureK), Math.log(p.value)] as [number, number]);
    const ref = linearRegression(xy);
    const mx = xy.reduce((sum, [x]) => sum + x, 0) / xy.length;
    const sxx = xy.reduce((sum, [x]) => sum + (x - mx) ** 2, 0);
    const ssr = xy.reduce((sum, [x, y]) => sum + (y - (ref.b + ref.m * x)) ** 2, 0);
    const se = Math.sqrt(ssr / (xy.length - 2) / sxx);
    expect(Math.abs(r.parameters.activationEnergyEv / ref.m - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.parameters.intercept / ref.b - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.standardErrors.activationEnergyEv! / se - 1)).toBeLessThan(1e-9);
    expect(r.residuals).toHaveLength(10_000);
    expect(Math.abs(r.residuals[17]! - (xy[17]![1] - (ref.b + ref.m * xy[17]![0])))).toBeLessThan(
      1e-9,
    );
  });

  it('uses an inclusive window and Student t with n - 2 degrees of freedom', () => {
    const pts = sweep(0.4, range(300, 400, 11), 0.02, 3);
    const r = fitArrhenius(pts, { minK: 310, maxK: 330 });
    expect(r.count).toBe(3);
    expect(r.tCritical).toBeCloseTo(12.706, 2);
    expect(
      r.confidenceIntervals95.activationEnergyEv![1] - r.parameters.activationEnergyEv,
    ).toBeCloseTo(r.tCritical * r.standardErrors.activationEnergyEv!, 12);
  });

  it('gives 95 % intervals that cover the truth in 90–99 % of noisy trials', () => {
    // Round trip: 2000 seeded trials, 12 points, 3 % noise in ln(rho).
    let covered = 0;
    const trials = 2000;
    const temps = range(250, 450, 12);
    for (let s = 0; s < trials; s++) {
      const r = fitArrhenius(sweep(0.35, temps, 0.03, 1000 + s));
      const ci = r.confidenceIntervals95.activationEnergyEv!;
      if (ci[0] <= 0.35 && 0.35 <= ci[1]) covered++;
    }
    const coverage = covered / trials;
    expect(coverage).toBeGreaterThan(0.9);
    expect(coverage).toBeLessThan(0.99);
  });

  it('has a standard error that scales with the noise', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1000 }), (seed) => {
        const a = fitArrhenius(sweep(0.3, range(200, 400, 20), 0.01, seed)).standardErrors
          .activationEnergyEv!;
        const b = fitArrhenius(sweep(0.3, range(200, 400, 20), 0.02, seed)).standardErrors
          .activationEnergyEv!;
        return Math.abs(b / a - 2) < 1e-6;
      }),
      { numRuns: 20 },
    );
  });
});

describe('fitArrhenius invalid inputs', () => {
  const pts = sweep(0.3, range(300, 400, 5));
  it('rejects windows with fewer than 3 points and degenerate data', () => {
    expect(() => fitArrhenius(pts, { minK: 390 })).toThrow(
      /`fitArrhenius`.*at least 3 points.*got 1/,
    );
    expect(() => fitArrhenius(pts.slice(0, 2))).toThrow(RangeError);
    expect(() => fitArrhenius([pts[0]!, pts[0]!, pts[0]!])).toThrow(/distinct temperatures/);
    expect(() => fitArrhenius(pts, { minK: 400, maxK: 300 })).toThrow(/minK/);
  });
  it('rejects bad points and options', () => {
    expect(() => fitArrhenius([...pts, { temperatureK: 300, value: 0 }])).toThrow(
      /points\[5\]\.value/,
    );
    expect(() => fitArrhenius([...pts, { temperatureK: Number.NaN, value: 1 }])).toThrow(
      RangeError,
    );
    const textual: unknown = { temperatureK: '300', value: 1 };
    expect(() => fitArrhenius([...pts, textual as (typeof pts)[number]])).toThrow(
      /points\[5\]\.temperatureK to be a number/,
    );
    const notAList: unknown = 'x';
    expect(() => fitArrhenius(notAList as typeof pts)).toThrow(TypeError);
    expect(() => fitArrhenius(pts, { quantity: 'mobility' as 'resistivity' })).toThrow(/quantity/);
    expect(() => fitArrhenius(pts, { prefactorExponent: Number.NaN })).toThrow(/prefactorExponent/);
  });
});
