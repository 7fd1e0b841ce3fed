import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Doping } from './dopants';
import { BOLTZMANN_EV_PER_K } from '../constants';
import { densityOfStates } from './density-of-states';
import { intrinsicDensity } from './intrinsic';
import { carrierDensities } from './neutrality';
import { regimeBoundaries, windowLimits } from './regimes';

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
    // Compensation 95 %: the old rule (ionized fraction of the donors, always above 95 %) gave
    // null; on the net doping (issue 13) n stays below 0.9 (N_D - N_A) until most of the
    // uncompensated 5e14 donors are ionized, about 120 K (the compensated freeze-out law
    // n = ((N_D - N_A)/N_A)(Nc/2) exp(-Ed/kT), Sze 1981, from memory).
    const t = regimeBoundaries('Si', d(1e16, 9.5e15)).freezeOutBelowK!;
    const [nd, na] = [1e16, 9.5e15];
    const n = 0.9 * (nd - na);
    const ed = 0.045 - 3e-8 * Math.cbrt(nd + na); // Pearson & Bardeen 1949 lowering
    const k = (densityOfStates('Si', t).conduction / 2) * Math.exp(-ed / (BOLTZMANN_EV_PER_K * t));
    // n (N_A + n) / (N_D - N_A - n) = (Nc/2) exp(-Ed/kT) at the boundary; tolerance 1 %.
    expect((n * (na + n)) / (nd - na - n) / k).toBeCloseTo(1, 2);
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

describe('regime rule on the net doping (issue 13, defect 2)', () => {
  it('labels compensated silicon frozen out when n is far below N_D - N_A', () => {
    // Issue 13: Si with N_D 1e15, N_A 9.5e14 at 20 K has n / (N_D - N_A) of about 1e-8; the old
    // rule (ionized fraction of the donors, over 95 % here) called it extrinsic.
    const c = carrierDensities('Si', d(1e15, 9.5e14), 20);
    expect(c.electrons / 5e13).toBeLessThan(1e-6);
    expect(c.regime).toBe('freeze-out');
    // The boundary uses the same rule: 20 K lies below it.
    expect(regimeBoundaries('Si', d(1e15, 9.5e14)).freezeOutBelowK!).toBeGreaterThan(20);
  });

  it('labels p-type samples on the hole density', () => {
    const b = regimeBoundaries('Si', d(0, 1e15));
    expect(carrierDensities('Si', d(0, 1e15), b.freezeOutBelowK! - 0.5).regime).toBe('freeze-out');
    expect(carrierDensities('Si', d(0, 1e15), b.freezeOutBelowK! + 0.5).regime).toBe('extrinsic');
  });
});

describe('windowLimits', () => {
  it('ends freeze-out at half the net doping and starts intrinsic at n_i = 3 N_net', () => {
    // Issue 13 definitions; checked against the solver itself and n_i. Tolerances 1e-4.
    for (const doping of [d(1e15), d(1e16, 2e15), d(0, 3e15)]) {
      const w = windowLimits('Si', doping);
      const net = Math.abs(doping.donorDensity - doping.acceptorDensity);
      const c = carrierDensities('Si', doping, w.freezeOutEndK!);
      const majority = doping.donorDensity > doping.acceptorDensity ? c.electrons : c.holes;
      expect(majority / net).toBeCloseTo(0.5, 4);
      expect(intrinsicDensity('Si', w.intrinsicStartK!) / (3 * net)).toBeCloseTo(1, 4);
      const b = regimeBoundaries('Si', doping);
      expect(w.freezeOutEndK!).toBeLessThan(b.freezeOutBelowK!);
      expect(w.intrinsicStartK!).toBeGreaterThan(b.intrinsicAboveK!);
    }
  });

  it('holds its documented example', () => {
    const w = windowLimits('Si', { donorDensity: 1e15, acceptorDensity: 0, donor: 'P' });
    expect(w.freezeOutEndK!).toBeCloseTo(62.2, 1);
    expect(w.intrinsicStartK!).toBeCloseTo(591.3, 1);
  });

  it('gives null limits for an exactly compensated sample', () => {
    expect(windowLimits('Si', d(1e15, 1e15))).toEqual({
      freezeOutEndK: null,
      intrinsicStartK: null,
    });
  });
});

describe('regimeBoundaries invalid inputs', () => {
  it('rejects bad arguments', () => {
    expect(() => regimeBoundaries('Si', d(-1))).toThrow(/`regimeBoundaries`.*donorDensity/);
    expect(() => regimeBoundaries('Sn' as 'Si', d(1e15))).toThrow(/material/);
    expect(() => regimeBoundaries('Si', undefined as unknown as Doping)).toThrow(TypeError);
    expect(() => windowLimits('Si', d(-1))).toThrow(/`windowLimits`.*donorDensity/);
  });
});
