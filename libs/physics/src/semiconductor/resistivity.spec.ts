import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { siliconResistivityFromDopant } from '../silicon/astm-f723';
import type { Doping } from './dopants';
import { modelCurve, resistivity } from './resistivity';

const n = (donorDensity: number): Doping => ({ donorDensity, acceptorDensity: 0 });
const p = (acceptorDensity: number): Doping => ({ donorDensity: 0, acceptorDensity });

describe('resistivity', () => {
  it('agrees with ASTM F723 at 23 °C for 1e13 to 1e17 cm^-3', () => {
    // ASTM F723 (Thurber et al., NBS SP 400-64): an independent empirical relation.
    // Tolerance 8 % (model: Arora mobility, full neutrality solution).
    for (const dens of [1e13, 1e14, 1e15, 1e16, 1e17]) {
      const rn =
        resistivity('Si', n(dens), 296.15) / siliconResistivityFromDopant('phosphorus', dens);
      const rp = resistivity('Si', p(dens), 296.15) / siliconResistivityFromDopant('boron', dens);
      expect(Math.abs(rn - 1)).toBeLessThan(0.08);
      expect(Math.abs(rp - 1)).toBeLessThan(0.08);
    }
  });

  it('rises slowly with temperature in the extrinsic range, like a metal', () => {
    // Common practice, no source.
    expect(resistivity('Si', n(1e15), 400)).toBeGreaterThan(resistivity('Si', n(1e15), 250));
  });

  it('falls with temperature in the intrinsic range', () => {
    // Common practice, no source: carrier density rises faster than mobility falls.
    fc.assert(
      fc.property(
        fc.double({ min: 650, max: 1450, noNaN: true }),
        (t) => resistivity('Si', n(1e14), t + 20) < resistivity('Si', n(1e14), t),
      ),
    );
  });

  it('rises steeply on cooling into freeze-out', () => {
    // Common practice, no source.
    expect(resistivity('Si', n(1e15), 20)).toBeGreaterThan(100 * resistivity('Si', n(1e15), 100));
  });

  it('scales inversely with mobilityScale', () => {
    const base = resistivity('Si', n(1e15), 300);
    expect(resistivity('Si', n(1e15), 300, { mobilityScale: 2 }) / base).toBeCloseTo(0.5, 12);
  });

  it('reports the documented ceiling instead of Infinity for undoped silicon at 1 K', () => {
    expect(resistivity('Si', n(0), 1)).toBe(1e300);
  });

  it('is finite and positive everywhere in its range', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('Si', 'Ge', 'GaAs', '4H-SiC' as const),
        fc.double({ min: 1, max: 1500, noNaN: true }),
        fc.double({ min: 10, max: 20, noNaN: true }),
        (m, t, logN) => {
          const r = resistivity(
            m,
            { donorDensity: 10 ** logN, acceptorDensity: 10 ** (logN - 1) },
            t,
          );
          return Number.isFinite(r) && r > 0;
        },
      ),
    );
  });
});

describe('modelCurve', () => {
  it('matches resistivity point by point and keeps the order', () => {
    const temps = [500, 20, 300, 77];
    const curve = modelCurve('Si', n(1e15), temps);
    expect(curve.map((c) => c.temperatureK)).toEqual(temps);
    curve.forEach((c, i) => {
      // The curve starts each solve from its neighbour's root, a single value from an estimate:
      // the iterations stop at different points within rounding (1e-12 relative).
      const single = resistivity('Si', n(1e15), temps[i]!);
      expect(Math.abs(c.resistivityOhmCm / single - 1)).toBeLessThan(1e-12);
      expect(c.electronMobility).toBeGreaterThan(c.holeMobility);
    });
    expect(curve[1]!.regime).toBe('freeze-out');
    expect(curve[2]!.regime).toBe('extrinsic');
  });

  it('rebuilds resistivity from its own carriers and mobilities', () => {
    const [c] = modelCurve('Ge', p(1e16), [250]);
    const rho =
      1 / (1.602176634e-19 * (c!.electrons * c!.electronMobility + c!.holes * c!.holeMobility));
    expect(c!.resistivityOhmCm / rho).toBeCloseTo(1, 10);
  });
});

describe('resistivity and modelCurve invalid inputs', () => {
  it('rejects bad arguments', () => {
    expect(() => resistivity('Si', n(1e15), 300, { mobilityScale: 0 })).toThrow(
      /`resistivity`.*mobilityScale/,
    );
    expect(() => resistivity('Si', n(-5), 300)).toThrow(RangeError);
    expect(() => modelCurve('Si', n(1e15), [300, 0])).toThrow(/`modelCurve`.*temperaturesK\[1\]/);
    expect(() => modelCurve('Si', n(1e15), 300 as unknown as number[])).toThrow(TypeError);
    expect(() => modelCurve('Si', n(1e15), [300, '77' as unknown as number])).toThrow(TypeError);
  });
});
