import { describe, expect, it } from 'vitest';
import type { ResolvedDoping } from './dopants';
import { resolveDoping } from './dopants';
import type { SemiconductorId } from './material';
import { curveTerms, modelPointAt, resolveModel } from './resistivity';
import type { LnResistivity, LnResistivityGradient } from './resistivity-gradient';
import { lnResistivityAt, lnResistivityGradientAt } from './resistivity-gradient';

const CASES: Array<{ material: SemiconductorId; donorDensity: number; acceptorDensity: number }> = [
  { material: 'Si', donorDensity: 5e15, acceptorDensity: 1e15 },
  // Between the merge onset and the Mott density: 0 < bound share < 1.
  { material: 'Si', donorDensity: 6e17, acceptorDensity: 2e16 },
  { material: 'Si', donorDensity: 0, acceptorDensity: 3e16 },
  { material: 'Ge', donorDensity: 1e14, acceptorDensity: 8e14 },
  { material: 'GaAs', donorDensity: 2e16, acceptorDensity: 0 },
];
const TEMPERATURES_K = [15, 50, 150, 400, 1000];

const QUANTITIES = [
  'donorDensity',
  'acceptorDensity',
  'donorLevelEv',
  'acceptorLevelEv',
  'donorBoundFraction',
  'acceptorBoundFraction',
] as const;

function lnRho(
  material: SemiconductorId,
  doping: ResolvedDoping,
  temperatureK: number,
  scale = 1,
): number {
  const model = { ...resolveModel('test', material, undefined), mobilityScale: scale };
  const out: LnResistivity = { lnResistivity: 0, eta: 0 };
  lnResistivityAt(model, doping, curveTerms(model, temperatureK), Number.NaN, out);
  return out.lnResistivity;
}

describe('ln rho and its derivatives for the model fit', () => {
  it('gives the bits of modelPointAt for ln rho and the root', () => {
    for (const c of CASES) {
      const model = resolveModel('test', c.material, undefined);
      const d = resolveDoping('test', c.material, c);
      for (const t of TEMPERATURES_K) {
        const terms = curveTerms(model, t);
        const point = modelPointAt(model, d, terms, 0.3 * terms.neutral.epsG);
        const out: LnResistivity = { lnResistivity: 0, eta: 0 };
        lnResistivityAt(model, d, terms, 0.3 * terms.neutral.epsG, out);
        expect(out.lnResistivity).toBe(point.lnResistivity);
        expect(out.eta).toBe(point.eta);
      }
    }
  });

  it('has the derivatives of central differences of fresh solves', () => {
    // Common practice, no source: the implicit-function derivative of the neutrality root must
    // match numerical differentiation of the full solve. Derivatives are compared per unit of a
    // relative step for densities and the mobility scale, per eV and per unit share otherwise.
    for (const c of CASES) {
      const model = resolveModel('test', c.material, undefined);
      const d = resolveDoping('test', c.material, c);
      for (const t of TEMPERATURES_K) {
        const out = {} as LnResistivityGradient;
        lnResistivityGradientAt(model, d, curveTerms(model, t), Number.NaN, out);
        expect(out.lnResistivity).toBe(lnRho(c.material, d, t));
        for (const x of QUANTITIES) {
          const unit = x.endsWith('Density') ? d[x] : 1;
          if (unit === 0) continue;
          // Deep in freeze-out ln rho is steep in a bound share (d ln F / db = -e^s): the step
          // shrinks with the slope so the difference stays in the linear range.
          const h = (1e-6 * unit) / Math.max(1, Math.abs(out[x] * unit));
          const at = (v: number) => lnRho(c.material, { ...d, [x]: v }, t);
          // A bound share cannot be stepped outside 0 to 1: at an end, a one-sided second-order
          // difference.
          const inside = !x.endsWith('Fraction') || (d[x] - h >= 0 && d[x] + h <= 1);
          const side = d[x] + h > 1 ? -1 : 1;
          const numeric = inside
            ? (at(d[x] + h) - at(d[x] - h)) / (2 * h)
            : (side * (-3 * at(d[x]) + 4 * at(d[x] + side * h) - at(d[x] + 2 * side * h))) /
              (2 * h);
          const tolerance = 1e-6 + 1e-5 * Math.abs(numeric * unit);
          expect(Math.abs((out[x] - numeric) * unit), `${c.material} ${x} at ${t} K`).toBeLessThan(
            tolerance,
          );
        }
        const numericScale =
          (lnRho(c.material, d, t, Math.exp(1e-6)) - lnRho(c.material, d, t, Math.exp(-1e-6))) /
          2e-6;
        expect(Math.abs(out.lnMobilityScale - numericScale)).toBeLessThan(1e-6);
      }
    }
  });
});
