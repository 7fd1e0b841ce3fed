import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { siliconDopantFromResistivity, siliconResistivityFromDopant } from './astm-f723';

describe('siliconResistivityFromDopant', () => {
  it('evaluates the published ASTM F723 boron relation', () => {
    // ASTM F723 boron formula evaluated by hand at N = 1e16:
    // 1.305 + 11.33 / (1 + (2.58e-3)^-0.737) = 1.4434 ohm cm. Tolerance 1e-4.
    expect(siliconResistivityFromDopant('boron', 1e16)).toBeCloseTo(1.4434, 4);
    // Low-density limit: rho -> 1.305e16 / N (first term dominates). Tolerance 0.1 % at 1e12.
    expect(siliconResistivityFromDopant('boron', 1e12) / 13050).toBeCloseTo(1, 3);
  });

  it('evaluates the published ASTM F723 phosphorus relation', () => {
    // ASTM F723 phosphorus formula by hand at N = 1e16 (y = 0): (6.242e18 / 1e16) * 10^-3.0769
    // = 0.52291 ohm cm. Tolerance 1e-4.
    expect(siliconResistivityFromDopant('phosphorus', 1e16)).toBeCloseTo(0.52291, 4);
  });

  it('falls monotonically with density', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('boron', 'phosphorus' as const),
        fc.double({ min: 12, max: 20.5, noNaN: true }),
        (d, l) =>
          siliconResistivityFromDopant(d, 10 ** (l + 0.1)) <
          siliconResistivityFromDopant(d, 10 ** l),
      ),
    );
  });
});

describe('siliconDopantFromResistivity', () => {
  it('gives the rule-of-thumb densities at 1 ohm cm', () => {
    // Common practice, no source: 1 ohm cm n-type about 5e15 P, p-type about 1.5e16 B. Tolerance 10 %.
    expect(Math.abs(siliconDopantFromResistivity('phosphorus', 1) / 5e15 - 1)).toBeLessThan(0.1);
    expect(Math.abs(siliconDopantFromResistivity('boron', 1) / 1.5e16 - 1)).toBeLessThan(0.1);
  });

  it('evaluates the published inverse relations', () => {
    // ASTM F723 boron inverse by hand at rho = 1: 1.330e16 + 1.082e17 / (1 + 54.56^1.105)
    // = 1.4588e16. Phosphorus inverse at rho = 1 (x = 0): 6.242e18 * 10^-3.1083 = 4.8643e15.
    // Tolerance 1e-4 relative.
    expect(siliconDopantFromResistivity('boron', 1) / 1.4588e16).toBeCloseTo(1, 4);
    expect(siliconDopantFromResistivity('phosphorus', 1) / 4.8643e15).toBeCloseTo(1, 4);
  });

  it('round-trips with the forward relation within a few per cent', () => {
    // REFERENCES: each direction is its own fit; a round trip differs by up to a few per cent.
    for (const dopant of ['boron', 'phosphorus'] as const) {
      for (const n of [1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20]) {
        const back = siliconDopantFromResistivity(dopant, siliconResistivityFromDopant(dopant, n));
        expect(Math.abs(back / n - 1)).toBeLessThan(0.05);
      }
    }
  });
});

describe('ASTM F723 invalid inputs', () => {
  it('rejects unknown dopants and values outside the fitted ranges', () => {
    expect(() => siliconResistivityFromDopant('arsenic' as 'boron', 1e16)).toThrow(
      /`siliconResistivityFromDopant`.*dopant/,
    );
    expect(() => siliconResistivityFromDopant('boron', 0)).toThrow(/densityCm3/);
    expect(() => siliconResistivityFromDopant('phosphorus', 1e21)).toThrow(RangeError);
    expect(() => siliconDopantFromResistivity('boron', -1)).toThrow(
      /`siliconDopantFromResistivity`.*resistivityOhmCm/,
    );
    expect(() => siliconDopantFromResistivity('boron', Number.NaN)).toThrow(RangeError);
    expect(() => siliconDopantFromResistivity('phosphorus', 1e5)).toThrow(RangeError);
  });
});
