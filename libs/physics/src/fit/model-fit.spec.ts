import { describe, expect, it } from 'vitest';
import { seededNormal, seededRandom } from '../numeric/prng';
import { modelCurve } from '../semiconductor/resistivity';
import { levenbergMarquardt } from './levenberg-marquardt';
import { fitModel } from './model-fit';

function synthetic(seed: number) {
  const truth = { donorDensity: 5e15, acceptorDensity: 1e15, donorLevel: 0.045 };
  const temps = Array.from({ length: 120 }, (_, i) => 20 + i * 5);
  const n = seededNormal(seededRandom(seed));
  const points = modelCurve('Si', truth, temps).map((p) => ({
    temperatureK: p.temperatureK,
    resistivityOhmCm: p.resistivityOhmCm * (1 + 0.005 * n()),
  }));
  return { truth, points };
}

describe('fitModel', () => {
  it('fits a noisy synthetic sweep back within 3 % on densities and 3 meV on the level', () => {
    // Round trip: Si, Nd 5e15, Na 1e15, Ed 45 meV, 20–615 K, 0.5 % noise; start 3x off.
    const { truth, points } = synthetic(11);
    const fit = fitModel(
      points,
      'Si',
      { donorDensity: 1.5e16, acceptorDensity: 3e14, donorLevel: 0.035 },
      ['donorDensity', 'acceptorDensity', 'donorLevel'],
    );
    expect(fit.converged).toBe(true);
    expect(fit.reason.length).toBeGreaterThan(0);
    expect(Math.abs(fit.parameters.donorDensity / truth.donorDensity - 1)).toBeLessThan(0.03);
    expect(Math.abs(fit.parameters.acceptorDensity / truth.acceptorDensity - 1)).toBeLessThan(0.03);
    expect(Math.abs(fit.parameters.donorLevel - truth.donorLevel)).toBeLessThan(0.003);
    // Residual rms near the 0.5 % noise (ln rho), fixed parameters reported unchanged.
    const rms = Math.sqrt(fit.residuals.reduce((s, r) => s + r * r, 0) / fit.residuals.length);
    expect(rms).toBeGreaterThan(0.004);
    expect(rms).toBeLessThan(0.006);
    expect(fit.parameters.mobilityScale).toBe(1);
    expect(Object.keys(fit.standardErrors).sort()).toEqual([
      'acceptorDensity',
      'donorDensity',
      'donorLevel',
    ]);
    // The 95 % intervals contain the truth.
    const ci = fit.confidenceIntervals95.donorDensity!;
    expect(ci[0]).toBeLessThan(truth.donorDensity);
    expect(ci[1]).toBeGreaterThan(truth.donorDensity);
    expect(fit.standardErrors.donorLevel!).toBeGreaterThan(0);
  });

  it('fits the mobility scale together with the doping', () => {
    const { truth, points } = synthetic(5);
    const fit = fitModel(
      points,
      'Si',
      { donorDensity: 1e16, acceptorDensity: 5e14, donorLevel: 0.05 },
      ['donorDensity', 'acceptorDensity', 'donorLevel', 'mobilityScale'],
    );
    expect(fit.converged).toBe(true);
    expect(Math.abs(fit.parameters.donorDensity / truth.donorDensity - 1)).toBeLessThan(0.03);
    expect(Math.abs(fit.parameters.mobilityScale - 1)).toBeLessThan(0.02);
  });
});

describe('levenbergMarquardt', () => {
  it('reproduces ordinary least squares and its standard errors on a straight line', () => {
    const x = [1, 2, 3, 4, 5, 6];
    const y = [2.1, 3.9, 6.2, 7.8, 10.1, 12.2];
    const lm = levenbergMarquardt({
      residuals: (p) => x.map((xi, i) => p[0]! + p[1]! * xi - y[i]!),
      initial: [0, 0],
    });
    // Closed-form OLS: slope = Sxy / Sxx = 2.0086, se = sqrt(s^2 / Sxx).
    const mx = 3.5;
    const my = y.reduce((a, b) => a + b) / 6;
    const sxx = x.reduce((a, xi) => a + (xi - mx) ** 2, 0);
    const slope = x.reduce((a, xi, i) => a + (xi - mx) * (y[i]! - my), 0) / sxx;
    expect(lm.converged).toBe(true);
    expect(lm.parameters[1]).toBeCloseTo(slope, 8);
    const s2 = lm.cost / 4;
    expect(Math.sqrt(lm.unscaledCovariance![1]![1]! * s2)).toBeCloseTo(Math.sqrt(s2 / sxx), 6);
  });

  it('reports the iteration limit honestly', () => {
    const lm = levenbergMarquardt({
      residuals: (p) => [10 * (p[1]! - p[0]! * p[0]!), 1 - p[0]!],
      initial: [-1.2, 1],
      maxIterations: 2,
    });
    expect(lm.converged).toBe(false);
    expect(lm.reason).toMatch(/iteration limit/);
  });

  it('does not claim success when the model cannot be evaluated', () => {
    const lm = levenbergMarquardt({ residuals: () => [Number.NaN], initial: [1] });
    expect(lm.converged).toBe(false);
    expect(lm.reason).toMatch(/cannot be evaluated/);
  });

  it('flags non-identifiable parameters with a null covariance', () => {
    const lm = levenbergMarquardt({
      residuals: (p) => [p[0]! + p[1]! - 1, 2 * (p[0]! + p[1]!) - 2],
      initial: [0, 0],
    });
    expect(lm.unscaledCovariance).toBeNull();
  });
});

describe('fitModel invalid inputs', () => {
  const { points } = synthetic(1);
  const start = { donorDensity: 1e15, acceptorDensity: 0 };
  it('rejects bad free lists, starts and points', () => {
    expect(() => fitModel(points, 'Si', start, [])).toThrow(/`fitModel`.*free/);
    expect(() => fitModel(points, 'Si', start, ['bandGap' as 'donorLevel'])).toThrow(RangeError);
    expect(() => fitModel(points, 'Si', start, ['acceptorDensity'])).toThrow(
      /starting acceptorDensity above 0/,
    );
    expect(() => fitModel(points.slice(0, 1), 'Si', start, ['donorDensity'])).toThrow(RangeError);
    expect(() =>
      fitModel([{ temperatureK: 2000, resistivityOhmCm: 1 }, ...points], 'Si', start, [
        'donorDensity',
      ]),
    ).toThrow(/temperatureK/);
    expect(() => fitModel(points, 'Si', start, ['donorDensity', 'donorDensity'])).toThrow(/once/);
    expect(() => fitModel(points, 'Xx' as 'Si', start, ['donorDensity'])).toThrow(/material/);
  });
});
