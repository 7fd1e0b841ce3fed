import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Doping } from './dopants';
import { intrinsicDensity } from './intrinsic';
import { carrierDensities } from './neutrality';
import { regimeBoundaries } from './regimes';

const d = (donorDensity: number, acceptorDensity = 0): Doping => ({
  donorDensity,
  acceptorDensity,
});

describe('regimeBoundaries', () => {
  it('puts the boundaries where the regime labels change', () => {
    const b = regimeBoundaries('Si', d(1e15));
    expect(b.freezeOutBelowK).not.toBeNull();
    expect(b.intrinsicAboveK).not.toBeNull();
    const f = b.freezeOutBelowK!;
    const i = b.intrinsicAboveK!;
    expect(carrierDensities('Si', d(1e15), f - 0.5).regime).toBe('freeze-out');
    expect(carrierDensities('Si', d(1e15), f + 0.5).regime).toBe('extrinsic');
    expect(carrierDensities('Si', d(1e15), i - 0.5).regime).toBe('extrinsic');
    expect(carrierDensities('Si', d(1e15), i + 0.5).regime).toBe('intrinsic');
    // Definition: n_i equals the net doping at the intrinsic boundary. Tolerance 1e-6 relative.
    expect(intrinsicDensity('Si', i) / 1e15).toBeCloseTo(1, 6);
  });

  it('puts the intrinsic onset of 1e15 cm^-3 silicon near 550 K', () => {
    // Sze 1981, electron density against temperature for Si with Nd = 1e15 (from memory):
    // intrinsic onset between 500 K and 600 K.
    const i = regimeBoundaries('Si', d(1e15)).intrinsicAboveK!;
    expect(i).toBeGreaterThan(500);
    expect(i).toBeLessThan(600);
  });

  it('gives null where a boundary does not exist in 1–1500 K', () => {
    // Mott-density doping never freezes out; 1e20 never turns intrinsic below 1500 K.
    expect(regimeBoundaries('Si', d(1e20))).toEqual({
      freezeOutBelowK: null,
      intrinsicAboveK: null,
    });
    // Compensation 95 %: at least 95 % of the donors are always ionized.
    expect(regimeBoundaries('Si', d(1e16, 9.5e15)).freezeOutBelowK).toBeNull();
    // Undoped: no dopant to freeze out, intrinsic everywhere.
    expect(regimeBoundaries('Si', d(0))).toEqual({ freezeOutBelowK: null, intrinsicAboveK: null });
  });

  it('moves the intrinsic onset up with net doping', () => {
    fc.assert(
      fc.property(fc.double({ min: 11, max: 18, noNaN: true }), (logN) => {
        const lo = regimeBoundaries('Si', d(10 ** logN)).intrinsicAboveK!;
        const hi = regimeBoundaries('Si', d(10 ** (logN + 0.3))).intrinsicAboveK!;
        return hi > lo;
      }),
      { numRuns: 40 },
    );
  });

  it('gives a lower intrinsic onset for the narrower gap of germanium', () => {
    const ge = regimeBoundaries('Ge', d(1e15)).intrinsicAboveK!;
    expect(ge).toBeLessThan(regimeBoundaries('Si', d(1e15)).intrinsicAboveK!);
  });
});

describe('regimeBoundaries invalid inputs', () => {
  it('rejects bad arguments', () => {
    expect(() => regimeBoundaries('Si', d(-1))).toThrow(/`regimeBoundaries`.*donorDensity/);
    expect(() => regimeBoundaries('Sn' as 'Si', d(1e15))).toThrow(/material/);
    expect(() => regimeBoundaries('Si', undefined as unknown as Doping)).toThrow(TypeError);
  });
});
