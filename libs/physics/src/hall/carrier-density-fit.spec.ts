import { describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '../constants';
import { seededNormal, seededRandom } from '../numeric/prng';
import { fitCarrierDensity } from './carrier-density-fit';

/**
 * Electron density of compensated n-type silicon computed here, apart from the library:
 * n + N_A = N_D / (1 + 2 (n / Nc) exp(E_d / kT)), i.e. with phi = (Nc / 2) exp(-E_d / kT),
 * n^2 + (N_A + phi) n - (N_D - N_A) phi = 0 (Blakemore 1962, Semiconductor Statistics; Look
 * 1989, ch. 1), holes left out (below 400 K they change n by less than 1e-4 at 1e15).
 * Nc = 2.8e19 (T/300)^1.5 cm^-3 (Sze, Physics of Semiconductor Devices, 2nd ed.).
 */
function electronsCm3(t: number, nd: number, na: number, edEv: number): number {
  const nc = 2.8e19 * (t / 300) ** 1.5;
  const phi = (nc / 2) * Math.exp(-edEv / (BOLTZMANN_EV_PER_K * t));
  const b = na + phi;
  // The root in the form that keeps its digits when 4 (N_D - N_A) phi << b^2.
  return (2 * (nd - na) * phi) / (b + Math.sqrt(b * b + 4 * (nd - na) * phi));
}

describe('fitCarrierDensity', () => {
  const truth = { nd: 1e15, na: 1e14, ed: 0.045 };
  const normal = seededNormal(seededRandom(1958));
  const points: Array<{ temperatureK: number; densityCm3: number }> = [];
  for (let t = 20; t <= 400; t += 10) {
    const n = electronsCm3(t, truth.nd, truth.na, truth.ed);
    points.push({ temperatureK: t, densityCm3: n * (1 + 0.02 * normal()) });
  }

  it('fits a synthetic 20-400 K n(T) with 2 % noise back: N_D within 5 %, E_d within 3 meV', () => {
    const r = fitCarrierDensity(
      points,
      'Si',
      { donorDensity: 2e15, acceptorDensity: 3e13, donorLevel: 0.055 },
      ['donorDensity', 'acceptorDensity', 'donorLevel'],
      { densityOfStatesSet: 'sze-t15' },
    );
    expect(r.converged).toBe(true);
    expect(Math.abs(r.parameters.donorDensity / truth.nd - 1)).toBeLessThan(0.05);
    expect(Math.abs(r.parameters.donorLevel - truth.ed)).toBeLessThan(0.003);
    expect(Math.abs(r.parameters.acceptorDensity / truth.na - 1)).toBeLessThan(0.2);
    const [lo, hi] = r.confidenceIntervals95.donorDensity!;
    expect(lo).toBeLessThan(truth.nd);
    expect(hi).toBeGreaterThan(truth.nd);
    expect(r.stepCount).toBe(39);
    expect(r.residuals).toHaveLength(39);
    expect(r.warnings).toEqual([]);
  });

  it('keeps to the window and reports fixed parameters unchanged', () => {
    const r = fitCarrierDensity(
      points,
      'Si',
      { donorDensity: 2e15, acceptorDensity: 1e14, donorLevel: 0.045 },
      ['donorDensity'],
      { minK: 150, maxK: 400, densityOfStatesSet: 'sze-t15' },
    );
    expect(r.count).toBe(26);
    expect(r.parameters.acceptorDensity).toBe(1e14);
    // Saturation range: n = N_D - N_A (net 9e14 within the 2 % noise).
    expect(r.parameters.donorDensity / truth.nd).toBeCloseTo(1, 1);
  });

  it('refuses a bad free list, too few steps and a zero starting density that is free', () => {
    const start = { donorDensity: 1e15, acceptorDensity: 0 };
    expect(() => fitCarrierDensity(points, 'Si', start, ['acceptorDensity'])).toThrow(
      /fitCarrierDensity.*acceptorDensity above 0/,
    );
    expect(() =>
      fitCarrierDensity(points.slice(0, 2), 'Si', start, ['donorDensity', 'donorLevel']),
    ).toThrow(/more temperature steps/);
    expect(() => fitCarrierDensity(points, 'Si', start, ['mobilityScale' as 'donorLevel'])).toThrow(
      /free\[0\]/,
    );
  });
});
