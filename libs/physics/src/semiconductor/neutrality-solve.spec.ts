import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { brentRoot } from '../numeric/brent';
import { resolveDensityOfStatesSet } from './density-of-states';
import { resolveDoping } from './dopants';
import type { SemiconductorId } from './material';
import { neutralityFunction, neutralityRoot, temperatureTerms } from './neutrality-solve';
import { modelCurve } from './resistivity';

/** The previous solve, Brent's method on the whole bracket, tightened to 1e-13. */
function brentEta(material: SemiconductorId, nd: number, na: number, t: number): number {
  const set = resolveDensityOfStatesSet('test', material, undefined);
  const terms = temperatureTerms(material, set, t);
  const d = resolveDoping('test', material, { donorDensity: nd, acceptorDensity: na }, undefined);
  const g = neutralityFunction(terms, d);
  return brentRoot((x) => g.value(x), -80, terms.epsG + 80, 1e-13, 400).root;
}

function newton(material: SemiconductorId, nd: number, na: number, t: number, guess?: number) {
  const set = resolveDensityOfStatesSet('test', material, undefined);
  const terms = temperatureTerms(material, set, t);
  const d = resolveDoping('test', material, { donorDensity: nd, acceptorDensity: na }, undefined);
  return neutralityRoot(neutralityFunction(terms, d), terms, d, guess);
}

describe('the neutrality root by safeguarded Newton', () => {
  // n = Nc exp(eta - Eg/kT) and p = Nv exp(-eta): an error e in eta is a relative error e in n
  // and p, so agreement of eta within 1e-9 keeps every density within 1e-9 relative.
  it('agrees with Brent’s method within 1e-9 from 2 K to 1500 K and 1e10 to 1e21 cm^-3', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<SemiconductorId>('Si', 'Ge', 'GaAs', '4H-SiC'),
        fc.double({ min: 2, max: 1500, noNaN: true }),
        fc.double({ min: 10, max: 21, noNaN: true }),
        fc.double({ min: 0, max: 0.999, noNaN: true }),
        fc.boolean(),
        (material, t, logN, comp, nType) => {
          const major = Math.pow(10, logN);
          const [nd, na] = nType ? [major, major * comp] : [major * comp, major];
          const r = newton(material, nd, na, t);
          // Nearly exact compensation at a few kelvin flattens g (slope 1e-6): there the root
          // itself is known only to the rounding of g (1e-12) over the slope, for either method.
          const set = resolveDensityOfStatesSet('test', material, undefined);
          const terms = temperatureTerms(material, set, t);
          const d = resolveDoping('test', material, { donorDensity: nd, acceptorDensity: na });
          const out = { slope: 0 };
          neutralityFunction(terms, d).valueAndSlope(r.eta, out);
          const conditioning = 1e-12 / Math.abs(out.slope);
          return (
            r.converged && Math.abs(r.eta - brentEta(material, nd, na, t)) <= 1e-9 + conditioning
          );
        },
      ),
      { numRuns: 300 },
    );
  });

  it('reaches the same root from a poor start or one outside the bracket', () => {
    const reference = brentEta('Si', 1e16, 1e14, 40);
    for (const guess of [-1e6, -79, 0, 100, 1e6, Number.NaN]) {
      expect(Math.abs(newton('Si', 1e16, 1e14, 40, guess).eta - reference)).toBeLessThan(1e-9);
    }
  });

  it('needs fewer Newton steps from the root of a neighbouring temperature', () => {
    // Common practice, no source: a start near the root converges quadratically, so a few
    // steps reach 1e-8 (the point of the warm start).
    // The start modelCurve uses: the Fermi level (eV) extrapolated from 99 K and 100 K.
    const kT = (t: number) => 8.617333262e-5 * t;
    const e99 = newton('Si', 5e15, 1e15, 99).eta * kT(99);
    const e100 = newton('Si', 5e15, 1e15, 100).eta * kT(100);
    const warm = newton('Si', 5e15, 1e15, 101, (2 * e100 - e99) / kT(101));
    const cold = newton('Si', 5e15, 1e15, 101);
    expect(warm.newtonSteps).toBeGreaterThan(0);
    expect(warm.newtonSteps).toBeLessThanOrEqual(4);
    expect(warm.newtonSteps).toBeLessThan(cold.newtonSteps);
  });

  it('has the analytic slope of a central difference', () => {
    const set = resolveDensityOfStatesSet('test', 'Si', undefined);
    for (const t of [20, 60, 300, 900]) {
      const terms = temperatureTerms('Si', set, t);
      const d = resolveDoping('test', 'Si', { donorDensity: 3e16, acceptorDensity: 2e15 });
      const g = neutralityFunction(terms, d);
      for (const eta of [-5, 5, terms.epsG / 2, terms.epsG - 3]) {
        const out = { slope: 0 };
        expect(g.valueAndSlope(eta, out)).toBe(g.value(eta));
        const h = 1e-5;
        const numeric = (g.value(eta + h) - g.value(eta - h)) / (2 * h);
        expect(Math.abs(out.slope - numeric)).toBeLessThan(1e-6 * Math.max(1, Math.abs(numeric)));
      }
    }
  });

  it('keeps a warm-started curve within 1e-9 of cold solves point by point', () => {
    const temps = Array.from({ length: 200 }, (_, i) => 5 + i * 7.4);
    const doping = { donorDensity: 5e15, acceptorDensity: 1e15 };
    const warm = modelCurve('Si', doping, temps);
    // Relative difference; densities that underflow to 0 at a few kelvin must do so in both.
    const relative = (a: number, b: number) => (a === b ? 0 : Math.abs(a / b - 1));
    temps.forEach((t, i) => {
      const cold = modelCurve('Si', doping, [t])[0]!;
      expect(relative(warm[i]!.electrons, cold.electrons)).toBeLessThan(1e-9);
      expect(relative(warm[i]!.holes, cold.holes)).toBeLessThan(1e-9);
      expect(relative(warm[i]!.resistivityOhmCm, cold.resistivityOhmCm)).toBeLessThan(1e-9);
    });
  });
});
