import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '../constants';
import { densityOfStates } from './density-of-states';
import { intrinsicDensity } from './intrinsic';
import type { Doping } from './dopants';
import { carrierDensities } from './neutrality';

const si = (donorDensity: number, acceptorDensity = 0): Doping => ({
  donorDensity,
  acceptorDensity,
});

describe('carrierDensities', () => {
  it('gives full ionization and the mass-action law at room temperature', () => {
    // Common practice, no source: shallow donors at 1e15 are fully ionized at 300 K.
    const c = carrierDensities('Si', si(1e15), 300);
    expect(Math.abs(c.electrons / 1e15 - 1)).toBeLessThan(0.002);
    // Sze 1981: n p = n_i^2 under Boltzmann statistics. Tolerance 1e-8 relative.
    expect((c.electrons * c.holes) / intrinsicDensity('Si', 300) ** 2).toBeCloseTo(1, 8);
    expect(c.regime).toBe('extrinsic');
  });

  it('follows n = sqrt(Nc Nd / 2) exp(-Ed / 2kT) in uncompensated freeze-out', () => {
    // Sze; Blakemore, Semiconductor Statistics (from memory): uncompensated freeze-out.
    // Tolerance 1 % at 30 K, 1e16 P (the neglected terms are about n / Nd). The level is the
    // density-lowered one, Pearson & Bardeen 1949: 0.045 - 3e-8 (1e16)^(1/3) eV.
    const t = 30;
    const nc = densityOfStates('Si', t).conduction;
    const ed = 0.045 - 3e-8 * Math.cbrt(1e16);
    const expected = Math.sqrt((nc * 1e16) / 2) * Math.exp(-ed / (2 * BOLTZMANN_EV_PER_K * t));
    const c = carrierDensities('Si', { ...si(1e16), donor: 'P' }, t);
    expect(Math.abs(c.electrons / expected - 1)).toBeLessThan(0.01);
    expect(c.regime).toBe('freeze-out');
  });

  it('follows n (Na + n) / (Nd - Na - n) = (Nc/2) exp(-Ed/kT) in compensated freeze-out', () => {
    // Sze; Blakemore (from memory): compensated freeze-out, holes negligible; for n << Na it
    // reduces to n = ((Nd - Na)/Na)(Nc/2) exp(-Ed/kT). Level lowered by the total impurity
    // density (Pearson & Bardeen 1949). Tolerance 1 % at 30 K.
    const t = 30;
    const nc = densityOfStates('Si', t).conduction;
    const ed = 0.045 - 3e-8 * Math.cbrt(1e16 + 1e14);
    const k = (nc / 2) * Math.exp(-ed / (BOLTZMANN_EV_PER_K * t));
    const [nd, na] = [1e16, 1e14];
    const expected = (-(na + k) + Math.sqrt((na + k) ** 2 + 4 * k * (nd - na))) / 2;
    const c = carrierDensities('Si', si(nd, na), t);
    expect(Math.abs(c.electrons / expected - 1)).toBeLessThan(0.01);
    // Deeper in freeze-out (20 K) n << Na and the simple form holds within 1 %.
    const t2 = 20;
    const k2 =
      (densityOfStates('Si', t2).conduction / 2) * Math.exp(-ed / (BOLTZMANN_EV_PER_K * t2));
    const c2 = carrierDensities('Si', si(nd, na), t2);
    expect(Math.abs(c2.electrons / (((nd - na) / na) * k2) - 1)).toBeLessThan(0.01);
  });

  it('handles p-type samples with acceptor degeneracy 4', () => {
    // Common practice, no source: 1e16 boron is over 98 % ionized at 300 K.
    const c = carrierDensities(
      'Si',
      { donorDensity: 0, acceptorDensity: 1e16, acceptor: 'B' },
      300,
    );
    expect(c.holes / 1e16).toBeGreaterThan(0.98);
    expect(c.holes / 1e16).toBeLessThan(1.0001);
    expect(c.fermiLevelEv).toBeLessThan(0.3);
  });

  it('labels the three regimes of a lightly doped sample', () => {
    // Common practice, no source: freeze-out below about 50 K, intrinsic above about 600 K.
    expect(carrierDensities('Si', si(1e15), 30).regime).toBe('freeze-out');
    expect(carrierDensities('Si', si(1e15), 300).regime).toBe('extrinsic');
    expect(carrierDensities('Si', si(1e15), 800).regime).toBe('intrinsic');
  });

  it('keeps the tabulated level under the constant-level option', () => {
    // Sze 1981: n = sqrt(Nc Nd / 2) exp(-Ed / 2kT) with the full 45 meV. Tolerance 1 % at 30 K.
    const t = 30;
    const nc = densityOfStates('Si', t).conduction;
    const expected = Math.sqrt((nc * 1e16) / 2) * Math.exp(-0.045 / (2 * BOLTZMANN_EV_PER_K * t));
    const c = carrierDensities('Si', si(1e16), t, { ionizationModel: 'constant-level' });
    expect(Math.abs(c.electrons / expected - 1)).toBeLessThan(0.01);
  });

  it('treats silicon doping above the Mott density as fully ionized at any temperature', () => {
    for (const n of [4e18, 1e19, 1e20]) {
      for (const t of [10, 77, 300]) {
        const c = carrierDensities('Si', si(n), t);
        expect(c.regime).toBe('extrinsic');
        expect(c.ionizedDonors).toBe(n);
      }
    }
    expect(carrierDensities('Si', si(1e20), 300).nearDegenerate).toBe(true);
    expect(carrierDensities('Si', si(1e15), 300).nearDegenerate).toBe(false);
  });

  it('freezes out moderately doped silicon at 10 K (no bound-state leak)', () => {
    // Issue 13, defect 3: Si:P 1e17 at 10 K gave n = 1.9e15 (a share of the dopants counted as
    // merged with the band far below the Mott density, 3.7e18 for P, Altermatt et al. 2006,
    // from memory). Uncompensated freeze-out, n = sqrt(Nc Nd / 2) exp(-Ed / 2kT) with the
    // lowered level (Sze; Pearson & Bardeen 1949), gives about 1e9; tolerance 5 %.
    const t = 10;
    const c = carrierDensities('Si', { ...si(1e17), donor: 'P' }, t);
    expect(c.electrons).toBeLessThan(1e10);
    const ed = 0.045 - 3e-8 * Math.cbrt(1e17);
    const nc = densityOfStates('Si', t).conduction;
    const expected = Math.sqrt((nc * 1e17) / 2) * Math.exp(-ed / (2 * BOLTZMANN_EV_PER_K * t));
    expect(c.electrons / expected).toBeCloseTo(1, 1);
    expect(c.regime).toBe('freeze-out');
    expect(c.nearDegenerate).toBe(false);
  });

  it('uses the dopant name and an explicit level to pick the ionization energy', () => {
    // Sze: In in Si is deep (0.16 eV), so it is far less ionized than B at 100 K.
    const b = carrierDensities(
      'Si',
      { donorDensity: 0, acceptorDensity: 1e16, acceptor: 'B' },
      100,
    );
    const inn = carrierDensities(
      'Si',
      { donorDensity: 0, acceptorDensity: 1e16, acceptor: 'In' },
      100,
    );
    expect(inn.ionizedAcceptors).toBeLessThan(b.ionizedAcceptors / 100);
    const lvl = carrierDensities(
      'Si',
      { donorDensity: 0, acceptorDensity: 1e16, acceptorLevel: 0.16 },
      100,
    );
    expect(lvl.ionizedAcceptors).toBeCloseTo(inn.ionizedAcceptors, 0);
  });

  it('satisfies charge neutrality and stays finite from 10 K to 1500 K, 1e10 to 1e20 cm^-3', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 1500, noNaN: true }),
        fc.double({ min: 10, max: 20, noNaN: true }),
        fc.double({ min: 0, max: 0.99, noNaN: true }),
        fc.boolean(),
        (t, logN, comp, nType) => {
          const major = Math.pow(10, logN);
          const d = nType ? si(major, major * comp) : si(major * comp, major);
          const c = carrierDensities('Si', d, t);
          const values = [
            c.electrons,
            c.holes,
            c.ionizedDonors,
            c.ionizedAcceptors,
            c.fermiLevelEv,
          ];
          if (!values.every(Number.isFinite)) return false;
          const pos = c.holes + c.ionizedDonors;
          const neg = c.electrons + c.ionizedAcceptors;
          return Math.abs(pos - neg) <= 1e-8 * Math.max(pos, neg) + 1e-300;
        },
      ),
      { numRuns: 400 },
    );
  });

  it('moves the Fermi level down as donors give way to acceptors', () => {
    fc.assert(
      fc.property(fc.double({ min: 12, max: 17, noNaN: true }), (logN) => {
        const n = Math.pow(10, logN);
        const a = carrierDensities('Si', si(n, 0), 300).fermiLevelEv;
        const b = carrierDensities('Si', si(n, n / 2), 300).fermiLevelEv;
        const c = carrierDensities('Si', si(0, n), 300).fermiLevelEv;
        return a > b && b > c;
      }),
    );
  });

  it('returns finite results at 1 K', () => {
    const c = carrierDensities('Si', si(1e10), 1);
    expect(Number.isFinite(c.electrons) && Number.isFinite(c.fermiLevelEv)).toBe(true);
    expect(c.holes).toBeGreaterThanOrEqual(0);
  });
});

describe('carrierDensities invalid inputs', () => {
  it('rejects bad doping', () => {
    expect(() => carrierDensities('Si', si(-1), 300)).toThrow(/`carrierDensities`.*donorDensity/);
    expect(() => carrierDensities('Si', si(Number.NaN), 300)).toThrow(RangeError);
    expect(() => carrierDensities('Si', si(1e23), 300)).toThrow(RangeError);
    expect(() =>
      carrierDensities(
        'Si',
        { donorDensity: '1e15', acceptorDensity: 0 } as unknown as Doping,
        300,
      ),
    ).toThrow(TypeError);
    expect(() => carrierDensities('Si', null as unknown as Doping, 300)).toThrow(TypeError);
  });

  it('rejects dopants of another material and impossible levels', () => {
    expect(() => carrierDensities('GaAs', { ...si(1e15), donor: 'P' }, 300)).toThrow(
      /doping.donor.*GaAs/,
    );
    expect(() => carrierDensities('Si', { ...si(1e15), donor: 'B' as 'P' }, 300)).toThrow(
      RangeError,
    );
    expect(() => carrierDensities('Si', { ...si(1e15), donorLevel: 0 }, 300)).toThrow(/donorLevel/);
    expect(() => carrierDensities('Si', { ...si(1e15), acceptorLevel: 2 }, 300)).toThrow(
      /acceptorLevel/,
    );
  });

  it('rejects bad temperatures', () => {
    expect(() => carrierDensities('Si', si(1e15), 2000)).toThrow(/temperatureK.*2000/);
  });
});
