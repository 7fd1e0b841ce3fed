import { describe, expect, it } from 'vitest';
import { ionizeDoping } from '../semiconductor/dopants';
import { dopingLogs } from '../semiconductor/neutrality-solve';
import { curveTerms, resolveModel } from '../semiconductor/resistivity';
import { lnResistivityAt } from '../semiconductor/resistivity-gradient';
import type { CurveAt, ResolvedParameters } from './model-jacobian';
import { lnModelGradient } from './model-jacobian';
import { fitModel } from './model-fit';

// Coordinates q = [ln N_D, ln N_A, E0_d (eV), ln mobilityScale], resolved as fitModel does with
// the density-dependent level (Pearson–Bardeen), so the chain rule runs through ionizeDoping.
const model = resolveModel('test', 'Si', undefined);
function resolve(q: readonly number[]): ResolvedParameters {
  const doping = ionizeDoping(
    'Si',
    'pearson-bardeen-1949',
    Math.exp(q[0]!),
    Math.exp(q[1]!),
    q[2]!,
    0.045,
  );
  return { doping, model: { ...model, mobilityScale: Math.exp(q[3]!) }, logs: dopingLogs(doping) };
}
function lnRhoAt(q: readonly number[], t: number): number {
  const r = resolve(q);
  const out = { lnResistivity: 0, eta: 0 };
  lnResistivityAt(r.model, r.doping, curveTerms(r.model, t), Number.NaN, out);
  return out.lnResistivity;
}

describe('the Jacobian of fitModel', () => {
  it('matches central differences of ln rho in the fitted coordinates', () => {
    // Common practice, no source: an analytic Jacobian is checked against numerical
    // differentiation of the model it differentiates.
    const curves = new Map<number, CurveAt>();
    const curveAt = (t: number) => {
      if (!curves.has(t)) curves.set(t, { terms: curveTerms(model, t), eta: Number.NaN });
      return curves.get(t)!;
    };
    for (const q of [
      [Math.log(5e15), Math.log(1e15), 0.045, 0],
      [Math.log(8e17), Math.log(3e16), 0.05, Math.log(0.7)],
    ]) {
      const gradientAt = lnModelGradient(q, resolve, resolve, curveAt)!;
      for (const t of [20, 80, 300, 700]) {
        const gradient = new Float64Array(4);
        // The gradient's solve starts warm, the reference's cold: the roots agree to rounding.
        expect(Math.abs(gradientAt(t, gradient) - lnRhoAt(q, t))).toBeLessThan(1e-12);
        q.forEach((_, j) => {
          const h = 1e-5;
          const up = q.map((v, i) => (i === j ? v + h : v));
          const down = q.map((v, i) => (i === j ? v - h : v));
          const numeric = (lnRhoAt(up, t) - lnRhoAt(down, t)) / (2 * h);
          expect(Math.abs(gradient[j]! - numeric), `q${j} at ${t} K`).toBeLessThan(
            1e-6 + 1e-5 * Math.abs(numeric),
          );
        });
      }
    }
  });

  it('gives no gradient where the coordinates are infeasible', () => {
    const curveAt = (t: number): CurveAt => ({ terms: curveTerms(model, t), eta: Number.NaN });
    expect(lnModelGradient([0, 0, 0, 0], () => null, resolve, curveAt)).toBeNull();
  });

  it('does not let steps along a direction the data hardly fix pass for convergence', () => {
    // An n-type start with the acceptor level free: d ln rho / d E_a is about 1e-11, so the
    // undamped step along it is enormous and a damped one moves the sum of squares by nothing.
    // Such a step is no minimum: 5 Ω·cm with a 30 % ripple has none a doping explains.
    const points = Array.from({ length: 60 }, (_, i) => 25 + (i * 295) / 59).map((t) => ({
      temperatureK: t,
      resistivityOhmCm: 5 * (1 + 0.3 * Math.sin(t)),
    }));
    const fit = fitModel(points, 'Si', { donorDensity: 1e15, acceptorDensity: 1e14 }, [
      'donorDensity',
      'acceptorDensity',
      'donorLevel',
      'acceptorLevel',
      'mobilityScale',
    ]);
    expect(fit.converged).toBe(false);
    expect(fit.reason).not.toMatch(/below tolerance/);
  });
});
