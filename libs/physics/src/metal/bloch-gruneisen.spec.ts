import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { seededNormal, seededRandom } from '../numeric/prng';
import { blochGruneisen, blochGruneisenJ5, J5_INFINITY } from './bloch-gruneisen';
import { fitBlochGruneisen } from './bloch-gruneisen-fit';
import { METALS } from './metals';

/** Composite Simpson with 200,000 intervals: an independent reference for J5. */
function simpsonJ5(x: number): number {
  const n = 200_000;
  const h = x / n;
  const f = (z: number): number => (z === 0 ? 0 : (z ** 5 * Math.exp(z)) / Math.expm1(z) ** 2);
  let s = f(0) + f(x);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(i * h);
  return (s * h) / 3;
}

describe('blochGruneisenJ5', () => {
  it('tends to 5! zeta(5) = 124.4313 for large x', () => {
    // Abramowitz & Stegun table 23.3: zeta(5) = 1.0369277551. Tolerance 1e-12 relative.
    expect(J5_INFINITY).toBeCloseTo(124.4313306, 6);
    expect(blochGruneisenJ5(60) / 124.4313306172044).toBeCloseTo(1, 12);
  });

  it('follows x^4/4 - x^6/72 at small x', () => {
    // Series of z^2 e^z / (e^z - 1)^2 = 1 - z^2/12 + ...: common practice (Taylor expansion).
    const x = 0.01;
    expect(blochGruneisenJ5(x) / (x ** 4 / 4 - x ** 6 / 72)).toBeCloseTo(1, 10);
    expect(blochGruneisenJ5(1e-6)).toBeGreaterThan(0);
  });

  it('agrees with an independent Simpson integration and is continuous at the method switch', () => {
    for (const x of [0.3, 1, 3, 7.9, 8.1, 15])
      expect(blochGruneisenJ5(x) / simpsonJ5(x)).toBeCloseTo(1, 9);
    expect(blochGruneisenJ5(8 + 1e-9) / blochGruneisenJ5(8 - 1e-9)).toBeCloseTo(1, 9);
  });
});

describe('blochGruneisen', () => {
  const cu = { residualOhmCm: 0, couplingOhmCm: 1, debyeK: METALS.Cu.debyeK };
  cu.couplingOhmCm = 1.68e-6 / blochGruneisen(293.15, { ...cu, couplingOhmCm: 1 });

  it('gives copper a temperature coefficient close to the table value', () => {
    // Kittel Debye temperature 343 K; tables: alpha(Cu, 20 °C) = 0.0039 /K. Tolerance 5 %.
    const alpha = (blochGruneisen(294.15, cu) - blochGruneisen(292.15, cu)) / 2 / 1.68e-6;
    expect(Math.abs(alpha / 0.0039 - 1)).toBeLessThan(0.05);
  });

  it('is linear in T well above Theta and T^5 far below it', () => {
    // Bloch 1930; Ziman 1960: rho - rho0 -> A T / (4 Theta) at high T, ~ T^5 at low T.
    const p = { residualOhmCm: 1e-8, couplingOhmCm: 1e-5, debyeK: 300 };
    // With the next term of the small-x series: A (T / (4 Theta) - Theta / (72 T)). Tolerance 1e-6.
    expect(
      (blochGruneisen(3000, p) - 1e-8) / (1e-5 * (3000 / 1200 - 300 / (72 * 3000))),
    ).toBeCloseTo(1, 6);
    const low = (blochGruneisen(6, p) - 1e-8) / (blochGruneisen(3, p) - 1e-8);
    expect(low).toBeCloseTo(32, 4);
  });

  it('rises with temperature, as a metal does', () => {
    // Common practice, no source: metal resistivity rises with temperature.
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 2000, noNaN: true }),
        (t) => blochGruneisen(t * 1.05, cu) > blochGruneisen(t, cu),
      ),
    );
  });
});

describe('fitBlochGruneisen', () => {
  it('fits back a noisy synthetic copper sweep', () => {
    const truth = { residualOhmCm: 2e-8, couplingOhmCm: 1e-5, debyeK: 343 };
    const n = seededNormal(seededRandom(21));
    const points = Array.from({ length: 60 }, (_, i) => {
      const t = 10 + i * 6.5;
      return { temperatureK: t, resistivityOhmCm: blochGruneisen(t, truth) * (1 + 0.005 * n()) };
    });
    const fit = fitBlochGruneisen(points);
    expect(fit.converged).toBe(true);
    expect(Math.abs(fit.parameters.debyeK / 343 - 1)).toBeLessThan(0.02);
    expect(Math.abs(fit.parameters.residualOhmCm / 2e-8 - 1)).toBeLessThan(0.05);
    expect(Math.abs(fit.parameters.couplingOhmCm / 1e-5 - 1)).toBeLessThan(0.03);
    expect(fit.standardErrors.debyeK!).toBeGreaterThan(0);
    const rms = Math.sqrt(fit.residuals.reduce((s, r) => s + r * r, 0) / fit.residuals.length);
    expect(rms).toBeLessThan(0.01);
  });
});

describe('blochGruneisen invalid inputs', () => {
  it('rejects bad temperatures and parameters', () => {
    const p = { residualOhmCm: 0, couplingOhmCm: 1e-5, debyeK: 300 };
    expect(() => blochGruneisen(0, p)).toThrow(/`blochGruneisen`.*temperatureK/);
    expect(() => blochGruneisen(300, { ...p, debyeK: 0 })).toThrow(/debyeK/);
    expect(() => blochGruneisen(300, { ...p, residualOhmCm: -1 })).toThrow(/residualOhmCm/);
    expect(() => blochGruneisen(300, null as unknown as typeof p)).toThrow(TypeError);
    expect(() => blochGruneisenJ5(-1)).toThrow(RangeError);
    expect(() => fitBlochGruneisen([])).toThrow(/`fitBlochGruneisen`.*points/);
  });
});

describe('fitBlochGruneisen warnings', () => {
  it('says the Debye temperature is weakly constrained when the readings start above Theta/3', () => {
    // Kittel's Debye temperature of copper, 343 K; data only from 250 K up, where the curve is
    // nearly straight (Bloch–Grüneisen is linear in T above Theta: common practice, no source).
    const n = seededNormal(seededRandom(3));
    const pts = Array.from({ length: 60 }, (_, i) => {
      const t = 250 + 4 * i;
      const rho = blochGruneisen(t, { residualOhmCm: 2e-7, couplingOhmCm: 4e-6, debyeK: 343 });
      return { temperatureK: t, resistivityOhmCm: rho * (1 + 0.003 * n()) };
    });
    const r = fitBlochGruneisen(pts);
    expect(r.converged).toBe(true);
    expect(r.warnings.join(' ')).toMatch(/Debye temperature is weakly constrained/);
    expect(r.warnings.join(' ')).not.toMatch(/debyeK/);
  });

  it('gives no coverage caution when the readings reach well below Theta/3', () => {
    const pts = Array.from({ length: 40 }, (_, i) => {
      const t = 20 + 10 * i;
      const rho = blochGruneisen(t, { residualOhmCm: 2e-7, couplingOhmCm: 4e-6, debyeK: 343 });
      return { temperatureK: t, resistivityOhmCm: rho * (1 + 1e-4 * Math.sin(i)) };
    });
    const r = fitBlochGruneisen(pts);
    expect(r.warnings).toEqual([]);
    expect(r.parameters.debyeK).toBeCloseTo(343, 0);
  });
});
