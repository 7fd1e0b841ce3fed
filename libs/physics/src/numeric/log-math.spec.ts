import { describe, expect, it } from 'vitest';
import {
  logAddExp,
  logAddExpWithShares,
  logisticComplement,
  softplus,
  softplusWithLogistic,
} from './log-math';

// The identities checked here are elementary algebra (ln(e^a + e^b), e^a / (e^a + e^b) and the
// logistic function); the reference values are computed directly in double precision where
// nothing overflows.
describe('log-domain helpers', () => {
  const pairs: Array<[number, number]> = [
    [0, 0],
    [1, -2],
    [-3, 4.5],
    [-700, -702],
    [30, -30],
    [1e3, 999],
  ];

  it('gives the bits of logAddExp and shares that match the direct ratio and sum to one', () => {
    const out = { first: Number.NaN, second: Number.NaN };
    for (const [a, b] of pairs) {
      expect(logAddExpWithShares(a, b, out)).toBe(logAddExp(a, b));
      expect(out.first + out.second).toBeCloseTo(1, 15);
      if (Math.abs(a) < 700 && Math.abs(b) < 700) {
        const ea = Math.exp(a);
        const eb = Math.exp(b);
        expect(out.first).toBeCloseTo(ea / (ea + eb), 14);
        expect(out.second).toBeCloseTo(eb / (ea + eb), 14);
      }
    }
    // At ln-scale 1e3 the direct ratio overflows; the shares still hold: e^-1 / (1 + e^-1).
    logAddExpWithShares(999, 1e3, out);
    expect(out.first).toBeCloseTo(Math.exp(-1) / (1 + Math.exp(-1)), 15);
  });

  it('treats -Infinity as an absent term with no share', () => {
    const out = { first: Number.NaN, second: Number.NaN };
    expect(logAddExpWithShares(2.5, Number.NEGATIVE_INFINITY, out)).toBe(2.5);
    expect(out).toEqual({ first: 1, second: 0 });
    expect(logAddExpWithShares(Number.NEGATIVE_INFINITY, -1, out)).toBe(-1);
    expect(out).toEqual({ first: 0, second: 1 });
  });

  it('returns softplus and the logistic from one exponential, equal to the separate forms', () => {
    const out = { logistic: Number.NaN };
    for (const x of [-800, -30, -1, 0, 0.5, 30, 800]) {
      expect(softplusWithLogistic(x, out)).toBe(softplus(x));
      expect(out.logistic).toBe(logisticComplement(-x));
    }
  });
});
