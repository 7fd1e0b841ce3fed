import { describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '../constants';
import { seededNormal, seededRandom } from '../numeric/prng';
import { fitArrhenius } from './arrhenius';
import { dwellSteps } from './steps';

const k = BOLTZMANN_EV_PER_K;

/**
 * A dwell sweep: `steps` set points from 450 to 600 K, each recorded with one temperature error
 * (normal, `stepErrorK`) shared by its `readings` readings, each reading with `noise` relative
 * noise in resistivity.
 */
function dwellSweep(
  seed: number,
  ea: number,
  options: { steps?: number; readings?: number; stepErrorK?: number; noise?: number } = {},
): Array<{ temperatureK: number; value: number }> {
  const { steps = 10, readings = 20, stepErrorK = 0.5, noise = 0.003 } = options;
  const n = seededNormal(seededRandom(seed));
  const out: Array<{ temperatureK: number; value: number }> = [];
  for (let i = 0; i < steps; i++) {
    const trueK = 450 + (150 * i) / (steps - 1);
    const recordedK = trueK + stepErrorK * n();
    for (let j = 0; j < readings; j++) {
      out.push({
        temperatureK: recordedK,
        value: 1e-3 * Math.exp(ea / (k * trueK)) * (1 + noise * n()),
      });
    }
  }
  return out;
}

function coverage(temperatureUncertaintyK: number): number {
  const ea = 0.56;
  let covered = 0;
  for (let s = 0; s < 400; s++) {
    const r = fitArrhenius(dwellSweep(5000 + s, ea), { temperatureUncertaintyK });
    const ci = r.confidenceIntervals95.activationEnergyEv!;
    if (ci[0] <= ea && ea <= ci[1]) covered++;
  }
  return covered / 400;
}

describe('fitArrhenius on dwell steps', () => {
  // Defect: every reading counted as independent, so 20 readings per step shrank the interval
  // by about sqrt(20) and it covered the true Ea in about 31 % of these trials (measured on the
  // reading-by-reading fit). A 95 % interval must cover the truth in about 95 % of trials
  // (definition of a confidence interval; 90-99 % allows for 400 trials).
  it('covers the true Ea in 90-99 % of 400 trials with the temperature uncertainty given', () => {
    const c = coverage(0.5);
    expect(c).toBeGreaterThan(0.9);
    expect(c).toBeLessThan(0.99);
  });

  it('covers the true Ea in 90-99 % of the same trials without it (scatter of the means)', () => {
    const c = coverage(0);
    expect(c).toBeGreaterThan(0.9);
    expect(c).toBeLessThan(0.99);
  });

  it('counts readings and steps apart and fits 8 degrees of freedom for 10 steps', () => {
    const r = fitArrhenius(dwellSweep(3, 0.4));
    expect(r.count).toBe(200);
    expect(r.stepCount).toBe(10);
    expect(r.degreesOfFreedom).toBe(8);
    expect(r.residuals).toHaveLength(200);
    expect(r.converged).toBe(true);
  });

  it('leaves the standard error unchanged (within 5 %) when every reading is repeated k times', () => {
    for (const seed of [1, 2, 3]) {
      const pts = dwellSweep(seed, 0.3, { readings: 5 });
      const base = fitArrhenius(pts).standardErrors.activationEnergyEv!;
      for (const copies of [2, 5, 20]) {
        const repeated = pts.flatMap((p) => Array.from({ length: copies }, () => p));
        const se = fitArrhenius(repeated).standardErrors.activationEnergyEv!;
        expect(Math.abs(se / base - 1)).toBeLessThan(0.05);
      }
    }
  });

  it('widens the interval with the effective variance of the temperature (Orear 1982)', () => {
    // One reading per step, no resistivity noise: u_T is then the only uncertainty, and the
    // effective variance (b u_T / (k T^2))^2 makes the weights follow 1 / T^4 ratios.
    const pts = dwellSweep(8, 0.5, { readings: 1, noise: 0 });
    const plain = fitArrhenius(pts);
    const withT = fitArrhenius(pts, { temperatureUncertaintyK: 0.5 });
    expect(withT.converged).toBe(true);
    expect(withT.iterations).toBeGreaterThan(1);
    expect(
      Math.abs(withT.parameters.activationEnergyEv / plain.parameters.activationEnergyEv - 1),
    ).toBeLessThan(0.05);
  });

  it('reports significant curvature for a window spanning two activation energies', () => {
    // 0.2 eV below 500 K and 0.6 eV above (two regimes), against one straight activation.
    const temps = Array.from({ length: 12 }, (_, i) => 420 + i * 15);
    const n = seededNormal(seededRandom(4));
    const bent = temps.map((t) => ({
      temperatureK: t,
      value:
        (Math.exp(-0.2 / (k * t)) * 1e2 + Math.exp(-0.6 / (k * t)) * 1e6) ** -1 * (1 + 0.002 * n()),
    }));
    const straight = temps.map((t) => ({
      temperatureK: t,
      value: Math.exp(0.4 / (k * t)) * (1 + 0.002 * n()),
    }));
    expect(fitArrhenius(bent).curvature!.significant).toBe(true);
    const c = fitArrhenius(straight).curvature!;
    expect(c.significant).toBe(false);
    expect(Math.abs(c.t)).toBeLessThan(3);
    expect(fitArrhenius(straight.slice(0, 3)).curvature).toBeNull();
  });

  it('refuses a window with fewer than 3 steps', () => {
    const pts = dwellSweep(2, 0.3, { steps: 2, readings: 4 });
    expect(() => fitArrhenius(pts)).toThrow(/at least 3 temperature steps.*got 2/);
    expect(() => fitArrhenius(pts, { stepToleranceK: -1 })).toThrow(/stepToleranceK/);
  });
});

describe('dwellSteps', () => {
  it('groups consecutive readings within the tolerance of the first and pools single ones', () => {
    const steps = dwellSteps([300, 300.2, 300.5, 301, 310], [1, 3, 2, 5, 7], 0.5);
    expect(steps.map((s) => s.count)).toEqual([3, 1, 1]);
    expect(steps[0]!.mean).toBe(2);
    // Sample variance 1 over 3 readings; the single steps take the pooled variance (1).
    expect(steps[0]!.varianceOfMean).toBeCloseTo(1 / 3, 12);
    expect(steps[1]!.varianceOfMean).toBeCloseTo(1, 12);
  });
});
