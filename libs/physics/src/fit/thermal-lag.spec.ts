import { describe, expect, it } from 'vitest';
import { seededNormal, seededRandom } from '../numeric/prng';
import { thermalLag } from './thermal-lag';

// Synthetic: a sample trailing its sensor by L reads rho(T - L) warming and rho(T + L) cooling.
const curve = (t: number) => -2000 / t + 0.002 * t;

describe('thermalLag', () => {
  it('recovers a 1.0 K lag within 0.3 K from a noisy up/down pair (issue 15 check)', () => {
    const normal = seededNormal(seededRandom(21));
    const temps = Array.from({ length: 41 }, (_, i) => 250 + 5 * i);
    const up = { temperaturesK: temps, lnRho: temps.map((t) => curve(t - 1) + 0.002 * normal()) };
    const down = { temperaturesK: temps, lnRho: temps.map((t) => curve(t + 1) + 0.002 * normal()) };
    const lag = thermalLag(up, down)!;
    expect(Math.abs(lag.lagK - 1)).toBeLessThan(0.3);
    expect(lag.standardErrorK).toBeGreaterThan(0);
    expect(lag.standardErrorK).toBeLessThan(0.3);
  });

  it('gives the sign that says which way the sample trails, and nothing for a flat curve', () => {
    const temps = Array.from({ length: 21 }, (_, i) => 300 + 2 * i);
    const lead = thermalLag(
      { temperaturesK: temps, lnRho: temps.map((t) => curve(t + 0.5)) },
      { temperaturesK: temps, lnRho: temps.map((t) => curve(t - 0.5)) },
    )!;
    expect(lead.lagK).toBeCloseTo(-0.5, 2);
    const flat = { temperaturesK: temps, lnRho: temps.map(() => 1) };
    expect(thermalLag(flat, flat)).toBeNull();
  });
});
