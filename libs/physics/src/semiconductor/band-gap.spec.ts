import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bandGap, VARSHNI_PARAMETERS } from './band-gap';

describe('bandGap', () => {
  it('gives the Thurmond 1975 silicon gap at 300 K', () => {
    // Thurmond 1975, J. Electrochem. Soc. 122, 1133: Varshni with 1.170 eV, 4.73e-4 eV/K, 636 K,
    // evaluated by hand at 300 K: 1.17 - 4.73e-4 * 90000 / 936 = 1.12452 eV. Tolerance 1e-5 eV.
    expect(bandGap('Si', 300)).toBeCloseTo(1.12452, 5);
    // Sze, Physics of Semiconductor Devices (1981): 1.12 eV at 300 K. Tolerance 0.01 eV.
    expect(Math.abs(bandGap('Si', 300) - 1.12)).toBeLessThan(0.01);
  });

  it('tends to Eg0 at low temperature', () => {
    // Thurmond 1975: Eg(0) = 1.170 eV for Si. Tolerance 1e-5 eV at 1 K (the T^2/(T+beta) term is 7e-7 eV there).
    expect(bandGap('Si', 1)).toBeCloseTo(1.17, 5);
  });

  it('agrees with the Green 1990 linear silicon gap from 300 K to 500 K', () => {
    // Green 1990, J. Appl. Phys. 67, 2944: Eg = 1.206 - 2.73e-4 T eV above about 270 K.
    // Tolerance 5 meV (two independent fits of the same data).
    for (let t = 300; t <= 500; t += 25) {
      expect(Math.abs(bandGap('Si', t) - (1.206 - 2.73e-4 * t))).toBeLessThan(0.005);
    }
  });

  it('gives the quoted GaAs, Ge and 4H-SiC gaps at 300 K', () => {
    // Thurmond 1975 / Sze (Eg0 from memory): GaAs 1.424 eV at 300 K. Tolerance 3 meV.
    expect(Math.abs(bandGap('GaAs', 300) - 1.424)).toBeLessThan(0.003);
    // Sze 1981: Ge 0.66 eV at 300 K (Eg0 from memory). Tolerance 5 meV.
    expect(Math.abs(bandGap('Ge', 300) - 0.66)).toBeLessThan(0.005);
    // Device-simulator set (from memory): 4H-SiC 3.26 eV at 300 K. Tolerance 1e-9 eV.
    expect(bandGap('4H-SiC', 300)).toBeCloseTo(3.26, 9);
  });

  it('falls monotonically with temperature for every material (Varshni form, alpha > 0)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('Si', 'Ge', 'GaAs', '4H-SiC' as const),
        fc.double({ min: 1, max: 1499, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        (m, t, dt) => bandGap(m, Math.min(1500, t + dt)) < bandGap(m, t),
      ),
    );
  });

  it('documents each parameter set with a source', () => {
    for (const p of Object.values(VARSHNI_PARAMETERS))
      expect(p.source.label.length).toBeGreaterThan(0);
  });
});

describe('bandGap invalid inputs', () => {
  it('names the function and the argument for temperatures out of range', () => {
    expect(() => bandGap('Si', 0)).toThrow(RangeError);
    expect(() => bandGap('Si', 0)).toThrow(/`bandGap`.*temperatureK.*got 0/);
    expect(() => bandGap('Si', 1500.001)).toThrow(RangeError);
    expect(() => bandGap('Si', Number.NaN)).toThrow(RangeError);
    expect(() => bandGap('Si', Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });

  it('accepts the bounds within the 1e-9 K allowance', () => {
    expect(Number.isFinite(bandGap('Si', 1 - 1e-10))).toBe(true);
    expect(Number.isFinite(bandGap('Si', 1500 + 1e-10))).toBe(true);
  });

  it('rejects wrong types and unknown materials', () => {
    expect(() => bandGap('Si', '300' as unknown as number)).toThrow(TypeError);
    expect(() => bandGap('Xx' as 'Si', 300)).toThrow(/`bandGap`.*material/);
  });
});
