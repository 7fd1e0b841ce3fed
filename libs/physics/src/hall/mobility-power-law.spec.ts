import { describe, expect, it } from 'vitest';
import { seededNormal, seededRandom } from '../numeric/prng';
import { fitMobilityPowerLaw } from './mobility-power-law';

describe('fitMobilityPowerLaw', () => {
  it('fits the Morin & Maita lattice mobility of electrons back within 0.05 on the exponent', () => {
    // Morin & Maita 1954, Phys. Rev. 96, 28: mu_n about 4.0e9 T^-2.6 cm^2/(V s) (from memory).
    const normal = seededNormal(seededRandom(14));
    const points = [];
    for (let t = 100; t <= 400; t += 20) {
      for (let k = 0; k < 3; k++) {
        points.push({ temperatureK: t, mobility: 4.0e9 * t ** -2.6 * (1 + 0.02 * normal()) });
      }
    }
    const r = fitMobilityPowerLaw(points);
    expect(Math.abs(r.exponent + 2.6)).toBeLessThan(0.05);
    expect(r.mobilityAt300K / (4.0e9 * 300 ** -2.6)).toBeCloseTo(1, 1);
    expect(r.ci95[0]).toBeLessThan(-2.6);
    expect(r.ci95[1]).toBeGreaterThan(-2.6);
    expect(r.stepCount).toBe(16);
    expect(r.count).toBe(48);
    expect(r.rSquared).toBeGreaterThan(0.99);
    expect(r.converged).toBe(true);
    expect(r.parameters.exponent).toBe(r.exponent);
  });

  it('keeps to the window and fits holes (mu_p about 2.5e8 T^-2.3, from memory)', () => {
    const points = [20, 40, 60, 150, 200, 250, 300, 350].map((t) => ({
      temperatureK: t,
      // Below 100 K an impurity-limited rise that the window must leave out.
      mobility: t < 100 ? 50 * t : 2.5e8 * t ** -2.3,
    }));
    const r = fitMobilityPowerLaw(points, { minK: 140, maxK: 360 });
    expect(r.exponent).toBeCloseTo(-2.3, 9);
    expect(r.count).toBe(5);
  });

  it('refuses fewer than three steps in the window and reversed bounds', () => {
    const points = [100, 200, 300].map((t) => ({ temperatureK: t, mobility: 1e3 }));
    expect(() => fitMobilityPowerLaw(points, { minK: 150 })).toThrow(/at least 3 temperature/);
    expect(() => fitMobilityPowerLaw(points, { minK: 300, maxK: 100 })).toThrow(/maxK/);
    expect(() => fitMobilityPowerLaw([{ temperatureK: 100, mobility: -1 }])).toThrow(
      /points\[0\]\.mobility/,
    );
  });
});
