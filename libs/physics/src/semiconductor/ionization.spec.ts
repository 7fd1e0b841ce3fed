import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PHYSICS_DEFAULTS } from '../defaults';
import {
  boundShare,
  levelLoweringEvCm,
  mergeDensityCm3,
  mergeOnsetDecades,
  RELATIVE_PERMITTIVITY,
} from './ionization';

describe('level lowering and merge with the band', () => {
  it('uses the Pearson & Bardeen constant for silicon and scales it by 1/eps', () => {
    // Pearson & Bardeen 1949 (from memory): 3e-8 eV cm in silicon; Sze 1981 permittivities.
    expect(levelLoweringEvCm('Si')).toBe(3e-8);
    expect(levelLoweringEvCm('Ge')).toBeCloseTo((3e-8 * 11.9) / 16.0, 12);
    expect(levelLoweringEvCm('Ge')).toBeCloseTo(2.23e-8, 10); // the JSDoc example
    expect(levelLoweringEvCm('GaAs') * RELATIVE_PERMITTIVITY.GaAs.value).toBeCloseTo(
      3e-8 * 11.9,
      12,
    );
  });

  it('merges 45 meV silicon levels at (E0/alpha)^3 = 3.375e18', () => {
    expect(mergeDensityCm3('Si', 'pearson-bardeen-1949', 0.045, 'donor')).toBeCloseTo(
      3.375e18,
      -13,
    );
    expect(mergeDensityCm3('Si', 'constant-level', 0.045, 'acceptor')).toBe(
      PHYSICS_DEFAULTS.mottDensityCm3.Si.acceptor,
    );
  });

  it('keeps every level bound below the onset and none at the merge density', () => {
    const merge = 3.375e18;
    const onset = merge / 10 ** PHYSICS_DEFAULTS.mergeOnsetDecades;
    expect(boundShare(onset, merge, 0.045)).toBe(1);
    expect(boundShare(1e17, merge, 0.045)).toBe(1);
    expect(boundShare(merge, merge, 0.045)).toBe(0);
    // Deeper levels merge over more decades.
    expect(mergeOnsetDecades(0.2)).toBeGreaterThan(mergeOnsetDecades(0.045));
    expect(mergeOnsetDecades(0.01)).toBe(PHYSICS_DEFAULTS.mergeOnsetDecades);
  });

  it('falls monotonically and continuously between onset and merge (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 14, max: 21, noNaN: true }),
        fc.double({ min: 0.005, max: 0.3, noNaN: true }),
        (logN, level) => {
          const merge = 1e19;
          const n = 10 ** logN;
          const a = boundShare(n, merge, level);
          const b = boundShare(n * 1.001, merge, level);
          return a >= b && a - b < 0.01 && a >= 0 && a <= 1;
        },
      ),
      { numRuns: 300 },
    );
  });
});
