import { describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '../constants';
import { blochGruneisen } from '../metal/bloch-gruneisen';
import { fitBlochGruneisen } from '../metal/bloch-gruneisen-fit';
import { modelCurve } from '../semiconductor/resistivity';
import { fitArrhenius } from './arrhenius';
import type { FitResult } from './fit-result';
import { fitModel } from './model-fit';
import { fitLinearTcr } from './tcr';

// One result shape: every fit gives residuals as ln(observed / model), so a reading lifted 2 %
// above an otherwise exact curve shows a positive residual near ln(1.02) = 0.0198 (less the
// share the fit absorbs) in every kind. Defect: the model and Bloch–Grüneisen fits gave
// ln(model / observed), the TCR fit a relative residual.
const lift = <T extends { resistivityOhmCm: number }>(points: T[], at: number): T[] =>
  points.map((p, i) => (i === at ? { ...p, resistivityOhmCm: p.resistivityOhmCm * 1.02 } : p));
const temps = Array.from({ length: 40 }, (_, i) => 100 + 10 * i);

function expectShape<P extends string>(r: FitResult<P>, count: number, lifted: number): void {
  expect(r.residuals).toHaveLength(count);
  expect(r.residuals[lifted]!).toBeGreaterThan(0.015);
  expect(r.residuals[lifted]!).toBeLessThan(Math.log(1.02) + 1e-9);
  expect(r.count).toBe(count);
  expect(r.stepCount).toBe(count);
  expect(r.degreesOfFreedom).toBe(count - r.fitted.length);
  expect(r.correlation).toHaveLength(r.fitted.length);
  expect(typeof r.converged).toBe('boolean');
  expect(r.reason.length).toBeGreaterThan(0);
  expect(r.iterations).toBeGreaterThanOrEqual(1);
  for (const name of r.fitted) expect(r.confidenceIntervals95[name]).not.toBeUndefined();
}

describe('FitResult', () => {
  it('has the same fields and residual sign and unit in every fit', () => {
    const arrhenius = lift(
      temps.map((t) => ({
        temperatureK: t,
        resistivityOhmCm: Math.exp(0.05 / (BOLTZMANN_EV_PER_K * t)),
      })),
      20,
    );
    expectShape(
      fitArrhenius(
        arrhenius.map((p) => ({ temperatureK: p.temperatureK, value: p.resistivityOhmCm })),
      ),
      40,
      20,
    );
    const metal = lift(
      temps.map((t) => ({
        temperatureK: t,
        resistivityOhmCm: 1.68e-6 * (1 + 0.0039 * (t - 293.15)),
      })),
      20,
    );
    expectShape(fitLinearTcr(metal), 40, 20);
    const bg = lift(
      temps.map((t) => ({
        temperatureK: t,
        resistivityOhmCm: blochGruneisen(t, {
          residualOhmCm: 2e-7,
          couplingOhmCm: 7e-6,
          debyeK: 343,
        }),
      })),
      20,
    );
    expectShape(fitBlochGruneisen(bg), 40, 20);
    const si = lift(
      modelCurve('Si', { donorDensity: 5e15, acceptorDensity: 0 }, temps).map((p) => ({
        temperatureK: p.temperatureK,
        resistivityOhmCm: p.resistivityOhmCm,
      })),
      20,
    );
    expectShape(
      fitModel(si, 'Si', { donorDensity: 4e15, acceptorDensity: 0 }, ['donorDensity']),
      40,
      20,
    );
  });
});

describe('every fit on dwell-step means', () => {
  const noisy = (values: number[]) => {
    let s = 7;
    // A fixed pseudo-random ripple of about 0.3 %, the same for every kind.
    return values.map((v) => {
      s = (s * 16807) % 2147483647;
      return v * (1 + 0.006 * (s / 2147483647 - 0.5));
    });
  };
  const repeat = <T>(points: T[], k: number): T[] =>
    points.flatMap((p) => Array.from({ length: k }, () => p));
  const ratio = (a: number | null | undefined, b: number | null | undefined) => (a ?? 0) / (b ?? 1);

  it('keeps the standard errors of the model, TCR and Bloch–Grüneisen fits when readings repeat', () => {
    const rhoSi = noisy(
      modelCurve('Si', { donorDensity: 5e15, acceptorDensity: 0 }, temps).map(
        (p) => p.resistivityOhmCm,
      ),
    );
    const si = temps.map((t, i) => ({ temperatureK: t, resistivityOhmCm: rhoSi[i]! }));
    const start = { donorDensity: 4e15, acceptorDensity: 0 };
    const a = fitModel(si, 'Si', start, ['donorDensity']);
    const b = fitModel(repeat(si, 5), 'Si', start, ['donorDensity']);
    expect(b.count).toBe(200);
    expect(b.stepCount).toBe(40);
    expect(
      Math.abs(ratio(b.standardErrors.donorDensity, a.standardErrors.donorDensity) - 1),
    ).toBeLessThan(0.05);

    const cu = noisy(temps.map((t) => 1.68e-6 * (1 + 0.0039 * (t - 293.15)))).map((r, i) => ({
      temperatureK: temps[i]!,
      resistivityOhmCm: r,
    }));
    const c = fitLinearTcr(cu);
    const d = fitLinearTcr(repeat(cu, 5));
    expect(
      Math.abs(ratio(d.standardErrors.alphaPerK, c.standardErrors.alphaPerK) - 1),
    ).toBeLessThan(0.05);

    const truth = { residualOhmCm: 2e-7, couplingOhmCm: 7e-6, debyeK: 343 };
    const bg = noisy(temps.map((t) => blochGruneisen(t, truth))).map((r, i) => ({
      temperatureK: temps[i]!,
      resistivityOhmCm: r,
    }));
    const e = fitBlochGruneisen(bg);
    const f = fitBlochGruneisen(repeat(bg, 5));
    expect(Math.abs(ratio(f.standardErrors.debyeK, e.standardErrors.debyeK) - 1)).toBeLessThan(
      0.05,
    );
  });
});

describe('effective variance in the nonlinear fits', () => {
  it('reweights the Bloch–Grüneisen fit by the temperature uncertainty (Orear 1982)', () => {
    // Steps 20-400 K with one reading each and 0.3 % ripple: u_T = 2 K weighs down the steep
    // steps, so the fit runs the extra effective-variance rounds and the result moves.
    const truth = { residualOhmCm: 2e-7, couplingOhmCm: 7e-6, debyeK: 343 };
    const pts = temps.map((t, i) => ({
      temperatureK: t,
      resistivityOhmCm: blochGruneisen(t, truth) * (1 + 0.003 * Math.sin(3 * i)),
    }));
    const plain = fitBlochGruneisen(pts);
    const weighted = fitBlochGruneisen(pts, undefined, { temperatureUncertaintyK: 2 });
    expect(weighted.converged).toBe(true);
    expect(weighted.iterations).toBeGreaterThan(plain.iterations);
    expect(weighted.parameters.debyeK).not.toBe(plain.parameters.debyeK);
    expect(Math.abs(weighted.parameters.debyeK / 343 - 1)).toBeLessThan(0.05);
  });
});
