import { describe, expect, it } from 'vitest';
import { seededNormal, seededRandom } from '@rhotrace/physics';
import { hampelOutliers } from './hampel';
import { splitLegs } from './legs';
import { currentLevels, readingScatter } from './noise';
import { selfHeating, unsettledSteps } from './step-faults';

describe('splitLegs', () => {
  it('splits an up-and-down ramp at its top, keeping the dwell at the top with the rise', () => {
    const up = [300, 305, 310, 315, 320, 320.1, 319.9];
    const down = [315, 310, 305, 300];
    expect(splitLegs([...up, ...down], 0.5)).toEqual([
      { start: 0, end: 7, direction: 'up' },
      { start: 7, end: 11, direction: 'down' },
    ]);
  });

  it('does not turn on a single spike or on noise below three step tolerances', () => {
    const t = [300, 301, 302, 299, 303, 304, 302.8, 305, 306];
    expect(splitLegs(t, 0.5)).toEqual([{ start: 0, end: 9, direction: 'up' }]);
    expect(splitLegs([300, 300.4, 299.8, 300.3], 0.5)).toEqual([
      { start: 0, end: 4, direction: 'hold' },
    ]);
  });
});

describe('hampelOutliers', () => {
  it('finds a spike on a steep smooth curve and nothing on the clean curve', () => {
    // Hampel (1974) filter, window 7, 4 scaled MAD; a monotone curve has its own value as the
    // window median, so a clean ramp gives no outlier however steep.
    const t = Array.from({ length: 30 }, (_, i) => 300 + 5 * i);
    const clean = t.map((_, i) => -0.2 * i + 0.001 * i * i);
    const all = t.map((_, i) => i);
    expect(hampelOutliers(t, clean, all)).toEqual([]);
    const spiked = [...clean];
    spiked[12] = spiked[12]! + 0.05;
    expect(hampelOutliers(t, spiked, all).map((o) => o.index)).toEqual([12]);
  });
});

describe('readingScatter', () => {
  it('recovers the noise of one reading from second differences', () => {
    // von Neumann (1941) / Hall et al. (1990): Var(d2) = 6 sigma^2 for white noise.
    const normal = seededNormal(seededRandom(5));
    const x = Array.from({ length: 2000 }, (_, i) => 0.01 * i + 0.003 * normal());
    const s = readingScatter(x, [x.map((_, i) => i)])!;
    expect(Math.abs(s / 0.003 - 1)).toBeLessThan(0.1);
  });
});

describe('selfHeating and unsettledSteps', () => {
  it('gives dT = (rho2/rho1 - 1) / alpha for a reading 1 % high at alpha = 0.4 %/K', () => {
    // Issue check: 1 % high on alpha 0.4 %/K is a rise of 2.5 K (first-order expansion).
    const temperaturesK: number[] = [];
    const lnRho: number[] = [];
    const currentsA: number[] = [];
    for (let k = 0; k < 6; k++) {
      for (const [i, extra] of [
        [1e-3, 0],
        [1e-2, Math.log(1.01)],
      ] as const) {
        temperaturesK.push(300 + 10 * k);
        lnRho.push(0.004 * 10 * k + extra);
        currentsA.push(i);
      }
    }
    const steps = Array.from({ length: 6 }, (_, k) => [2 * k, 2 * k + 2] as [number, number]);
    const found = selfHeating({ temperaturesK, lnRho, currentsA }, steps, 0.0005);
    expect(found.map((f) => f.index)).toEqual([1, 3, 5, 7, 9, 11]);
    expect(found[2]!.reason).toMatch(/about 2\.5 K/);
    expect(selfHeating({ temperaturesK, lnRho, currentsA }, steps, 0.01)).toEqual([]);
  });

  it('flags a step whose readings still drift one way, not one that scatters', () => {
    const temperaturesK = Array(12).fill(300) as number[];
    const drift = [0, 0.002, 0.0035, 0.0045, 0.0052, 0.0057];
    const scatter = [0, 0.0004, -0.0003, 0.0002, -0.0004, 0.0001];
    const lnRho = [...drift, ...scatter];
    const currentsA = Array(12).fill(Number.NaN) as number[];
    const data = { temperaturesK, lnRho, currentsA };
    const found = unsettledSteps(
      data,
      [
        [0, 6],
        [6, 12],
      ],
      0.0004,
    );
    expect(found.map((f) => f.index)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(found[0]!.reason).toMatch(/6 readings at 300\.0 K drift by \+0\.5\d %/);
  });

  it('does not call a sweep logged while the temperature ramps unsettled', () => {
    // One reading every 0.05 K, grouped ten to a step: within a step rho rises with T as
    // rho ~ T^1.5 says (0.22 % over 0.45 K at 300 K), which is the ramp, not a dwell too short.
    const temperaturesK = Array.from({ length: 60 }, (_, i) => 300 + 0.05 * i);
    const lnRho = temperaturesK.map((t, i) => 1.5 * Math.log(t) + 0.0001 * Math.sin(7 * i));
    const currentsA = Array(60).fill(Number.NaN) as number[];
    const steps = Array.from({ length: 6 }, (_, k) => [10 * k, 10 * k + 10] as [number, number]);
    expect(unsettledSteps({ temperaturesK, lnRho, currentsA }, steps, 0.0002)).toEqual([]);
    // the same readings drifting 0.3 % one way beyond what their temperatures explain still are
    const lagging = lnRho.map((y, i) => (i < 10 ? y + 0.0003 * i : y));
    const found = unsettledSteps({ temperaturesK, lnRho: lagging, currentsA }, steps, 0.0002);
    expect(found.map((f) => f.index)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
  });
});

describe('currentLevels', () => {
  it('splits a dwell of 300,000 readings at two currents without running out of stack', () => {
    // A long stability log at one temperature: 1 mA and 10 mA alternating (hand case).
    const n = 300_000;
    const currentsA = Float64Array.from({ length: n }, (_, i) => (i % 2 ? 1e-2 : 1e-3));
    const { low, high } = currentLevels(currentsA, 0, n);
    expect(low).toHaveLength(n / 2);
    expect(high).toHaveLength(n / 2);
    expect(low[0]).toBe(0);
    expect(high[0]).toBe(1);
  });
});
