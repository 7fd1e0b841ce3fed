import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { siliconResistivityFromDopant } from '../silicon/astm-f723';
import type { Doping } from './dopants';
import { carrierDensities } from './neutrality';
import { resistivity } from './resistivity';

const donors = (n: number): Doping => ({ donorDensity: n, acceptorDensity: 0, donor: 'P' });
const acceptors = (n: number): Doping => ({ donorDensity: 0, acceptorDensity: n, acceptor: 'B' });
const SPECIES = [
  { name: 'phosphorus', doping: donors },
  { name: 'boron', doping: acceptors },
] as const;
/** Where the lowered 45 meV level meets the band edge: (0.045 / 3e-8)^3 cm^-3. */
const MERGE_CM3 = (0.045 / 3e-8) ** 3;

describe('heavily doped silicon (Pearson & Bardeen level lowering)', () => {
  it('reads extrinsic at 300 K from 1e18 to 1e19', () => {
    // Issue requirement and common practice: heavily doped silicon does not freeze out at room
    // temperature (Pearson & Bardeen 1949: the level merges with the band near 3e18).
    for (const { doping } of SPECIES) {
      for (const n of [1e18, 2e18, 5e18, 1e19]) {
        expect(carrierDensities('Si', doping(n), 300).regime).toBe('extrinsic');
      }
    }
  });

  it('has no resistivity step across 3e18 or at the merge density', () => {
    // Continuity of the model (the old switch at 3e18 gave 44 % for boron). The 2.9e18 to
    // 3.1e18 change is mostly the 6.9 % density change itself; tolerance 5 % (issue).
    for (const { doping } of SPECIES) {
      const a = resistivity('Si', doping(2.9e18), 300);
      const b = resistivity('Si', doping(3.1e18), 300);
      expect(Math.abs(b / a - 1)).toBeLessThan(0.05);
      // A 0.2 % density change around the merge density moves rho by about 0.15 %: no jump.
      const below = resistivity('Si', doping(MERGE_CM3 * 0.999), 300);
      const above = resistivity('Si', doping(MERGE_CM3 * 1.001), 300);
      expect(Math.abs(above / below - 1)).toBeLessThan(0.003);
    }
  });

  it('ionizes completely and continuously at the merge density', () => {
    // Pearson & Bardeen 1949: E = 0.045 - 3e-8 N^(1/3) eV reaches 0 at 3.375e18 cm^-3.
    const at = carrierDensities('Si', donors(MERGE_CM3), 77);
    expect(at.ionizedDonors).toBe(MERGE_CM3);
    const justBelow = carrierDensities('Si', donors(MERGE_CM3 * 0.999), 77);
    expect(justBelow.ionizedDonors / (MERGE_CM3 * 0.999)).toBeGreaterThan(0.9999);
    const p = carrierDensities('Si', acceptors(MERGE_CM3 * 0.999), 77);
    expect(p.ionizedAcceptors / (MERGE_CM3 * 0.999)).toBeGreaterThan(0.9999);
  });

  it('agrees with ASTM F723 at 300 K within 10 % from 1e14 to 1e19 cm^-3', () => {
    // ASTM F723 (Thurber et al., NBS SP 400-64), `siliconResistivityFromDopant`, which refers
    // to 23 °C; compared at 300 K as the issue asks. Worst deviation found: +8.8 % (phosphorus,
    // 1e14, where 300 K against 296.15 K alone accounts for about 3 %); between 1e17 and 1e19
    // the worst is 5.7 % (boron, 1e18, where the levels merge). Tolerances 10 % and 6 %.
    let worst = 0;
    for (const { name, doping } of SPECIES) {
      for (let i = 0; i <= 100; i++) {
        const n = 10 ** (14 + i * 0.05);
        const dev = resistivity('Si', doping(n), 300) / siliconResistivityFromDopant(name, n) - 1;
        worst = Math.max(worst, Math.abs(dev));
        expect(Math.abs(dev)).toBeLessThan(n >= 1e17 ? 0.06 : 0.1);
      }
    }
    expect(worst).toBeGreaterThan(0.05); // the check covers the region where the model differs
  });

  it('merges continuously at the tabulated Mott density under the constant-level option', () => {
    // The switch-off keeps the tabulated 45 meV level, so 5e17 boron (below the merge onset)
    // still freezes out at 300 K, but the old step across 3e18 (x1.44 for boron, issue 13) is
    // gone: the 2.9e18 to 3.1e18 change stays within the 6.9 % density change plus 5 %.
    const o = { ionizationModel: 'constant-level' } as const;
    expect(carrierDensities('Si', acceptors(5e16), 300, o).regime).toBe('extrinsic');
    expect(carrierDensities('Si', acceptors(5e17), 300, o).regime).toBe('freeze-out');
    const a = resistivity('Si', acceptors(2.9e18), 300, o);
    const b = resistivity('Si', acceptors(3.1e18), 300, o);
    expect(a / b).toBeLessThan(1.12);
    expect(a / b).toBeGreaterThan(1);
  });

  it('rejects an unknown ionization model', () => {
    expect(() =>
      resistivity('Si', donors(1e16), 300, { ionizationModel: 'bohr' as 'constant-level' }),
    ).toThrow(/`resistivity`.*ionizationModel/);
    // Every material has the level-lowering model now (issue 13: continuous for all).
    const ge = carrierDensities('Ge', donors(1e16), 300, {
      ionizationModel: 'pearson-bardeen-1949',
    });
    expect(ge.regime).toBe('extrinsic');
  });

  it('gives a 300 K resistivity that falls monotonically with doping (property)', () => {
    // Common practice: more dopant, more carriers; the mobility falls more slowly than 1/N.
    fc.assert(
      fc.property(
        fc.double({ min: 14, max: 19.5, noNaN: true }),
        fc.double({ min: 1.0001, max: 3, noNaN: true }),
        fc.boolean(),
        (logN, ratio, pType) => {
          const n = 10 ** logN;
          const make = pType ? acceptors : donors;
          return resistivity('Si', make(n * ratio), 300) < resistivity('Si', make(n), 300);
        },
      ),
      { numRuns: 400 },
    );
  });
});
