import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PHYSICS_DEFAULTS } from '../defaults';
import { mobility } from './mobility';

/** Masetti et al. 1983, IEEE Trans. Electron Devices 30, 764, phosphorus (from memory). */
function masettiElectron(n: number): number {
  return (
    68.5 +
    (1414 - 68.5) / (1 + Math.pow(n / 9.2e16, 0.711)) -
    56.1 / (1 + Math.pow(3.41e20 / n, 1.98))
  );
}

describe('mobility', () => {
  it('uses Arora–Hauser–Roulston 1982 for silicon by default', () => {
    expect(PHYSICS_DEFAULTS.mobilityModel.Si).toBe('arora-1982');
    // Arora, Hauser & Roulston 1982 formula at 300 K, N = 1e17, by hand:
    // 88 + 1252 / (1 + (1e17 / 1.26e17)^0.88) = 777.4. Tolerance 0.1.
    expect(mobility('Si', 'electron', 300, 1e17)).toBeCloseTo(777.4, 1);
    // Same for holes: 54.3 + 407 / (1 + (1e17 / 2.35e17)^0.88) = 330.9. Tolerance 0.1.
    expect(mobility('Si', 'hole', 300, 1e17)).toBeCloseTo(330.9, 1);
  });

  it('approaches the lattice-limited silicon mobility at low doping', () => {
    // REFERENCES: lattice-limited 1417 (electrons) and 470.5 (holes) cm^2/(V s) at 300 K.
    // Tolerance 6 % (Arora's fit gives 1340 and 461).
    expect(Math.abs(mobility('Si', 'electron', 300, 1e12) / 1417 - 1)).toBeLessThan(0.06);
    expect(Math.abs(mobility('Si', 'hole', 300, 1e12) / 470.5 - 1)).toBeLessThan(0.03);
  });

  it('agrees with Masetti et al. 1983 for electrons from 1e15 to 1e18', () => {
    // Masetti 1983 (from memory). Tolerance 10 % (independent fits of the same data).
    for (const n of [1e15, 1e16, 1e17, 1e18]) {
      expect(Math.abs(mobility('Si', 'electron', 300, n) / masettiElectron(n) - 1)).toBeLessThan(
        0.1,
      );
    }
  });

  it('falls roughly as T^-2.3 (electrons) in lightly doped silicon', () => {
    // REFERENCES: lattice mobility in Si falls roughly as T^-2.3; tolerance: exponent 2.0 to 2.4.
    const exponent =
      -Math.log(mobility('Si', 'electron', 400, 1e12) / mobility('Si', 'electron', 300, 1e12)) /
      Math.log(4 / 3);
    expect(exponent).toBeGreaterThan(2.0);
    expect(exponent).toBeLessThan(2.4);
  });

  it('has the ideal T^-3/2 lattice term in the Caughey–Thomas option', () => {
    // Ideal acoustic-phonon scattering: mu_L ~ T^-3/2 (common practice, no source); Caughey &
    // Thomas 1967 electron set, mu_max 1330. Undoped: mu = mu_L. Tolerance 1e-6 relative.
    const opts = { mobilityModel: 'caughey-thomas-ideal' as const };
    expect(mobility('Si', 'electron', 600, 0, opts) / (1330 * Math.pow(2, -1.5))).toBeCloseTo(1, 6);
    // Caughey & Thomas 1967: at N = N_ref the mobility is midway between mu_min and mu_max.
    expect(mobility('Si', 'electron', 300, 8.5e16, opts)).toBeCloseTo((65 + 1330) / 2, 6);
  });

  it('gives the Sze 300 K mobilities of lightly doped GaAs and Ge', () => {
    // Sze 1981: GaAs electrons 8500, Ge electrons 3900 cm^2/(V s) at 300 K. Tolerance 5 %.
    expect(Math.abs(mobility('GaAs', 'electron', 300, 1e14) / 8500 - 1)).toBeLessThan(0.05);
    expect(Math.abs(mobility('Ge', 'electron', 300, 1e12) / 3900 - 1)).toBeLessThan(0.05);
  });

  it('falls with impurity density at fixed temperature', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('Si', 'Ge', 'GaAs', '4H-SiC' as const),
        fc.constantFrom('electron', 'hole' as const),
        fc.double({ min: 50, max: 1000, noNaN: true }),
        fc.double({ min: 12, max: 20, noNaN: true }),
        (m, c, t, logN) =>
          mobility(m, c, t, Math.pow(10, logN + 0.5)) < mobility(m, c, t, Math.pow(10, logN)),
      ),
    );
  });

  it('falls with temperature for lightly doped silicon (lattice scattering)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 1400, noNaN: true }),
        (t) => mobility('Si', 'hole', t + 50, 1e13) < mobility('Si', 'hole', t, 1e13),
      ),
    );
  });
});

describe('mobility invalid inputs', () => {
  it('rejects bad arguments', () => {
    expect(() => mobility('Si', 'proton' as 'hole', 300, 1e15)).toThrow(/`mobility`.*carrier/);
    expect(() => mobility('Si', 'electron', 300, -1)).toThrow(/totalImpurityDensity/);
    expect(() => mobility('Si', 'electron', 0, 1e15)).toThrow(/temperatureK/);
    expect(() => mobility('Ge', 'electron', 300, 1e15, { mobilityModel: 'arora-1982' })).toThrow(
      RangeError,
    );
    expect(() => mobility('Si', 'electron', 300, Number.NaN)).toThrow(RangeError);
  });
});
