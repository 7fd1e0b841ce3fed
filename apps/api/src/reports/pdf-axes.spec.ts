import { describe, expect, it } from 'vitest';
import { decadeLabel, decadeTicks, niceStep, niceTicks } from './pdf-axes';
import { geometryText, sig } from './pdf-document';

// Round-number ticks (1, 2, 5 × 10^k) are common practice for printed axes, no source.
describe('printed axis ticks', () => {
  it('are round numbers covering the data', () => {
    expect(niceTicks(96.41, 573.1)).toEqual([0, 100, 200, 300, 400, 500, 600]);
    expect(niceTicks(291.2, 301.7)).toEqual([290, 292, 294, 296, 298, 300, 302]);
    expect(niceTicks(0.0123, 0.0189)).toEqual([
      0.012, 0.013, 0.014, 0.015, 0.016, 0.017, 0.018, 0.019,
    ]);
    expect(niceStep(1, 5)).toBe(0.2);
    expect(niceStep(8, 2)).toBe(5);
  });

  it('put whole decades on log axes, labelled as values or powers of ten', () => {
    expect(decadeTicks(0.37, 52)).toEqual([-1, 0, 1, 2]);
    expect(decadeTicks(5, 5)).toEqual([0, 1]);
    expect(decadeTicks(10, 10)).toEqual([0, 1, 2]);
    expect(decadeLabel(-1)).toEqual({ base: '0.1', exponent: null });
    expect(decadeLabel(3)).toEqual({ base: '1000', exponent: null });
    expect(decadeLabel(-6)).toEqual({ base: '10', exponent: '−6' });
  });
});

describe('printed geometry and numbers', () => {
  it('read as words in the units a lab uses, never the stored names', () => {
    const text = geometryText({ thicknessCm: 0.0525, diameterCm: 15, spacingCm: 0.1 });
    expect(text).toBe('thickness 525.0 µm, diameter 150.0 mm, probe spacing 1.000 mm');
    expect(text).not.toMatch(/Cm\b/);
  });

  it('write very small and large values as powers of ten', () => {
    expect(sig(2.5e15, 3)).toBe('2.50 × 10^15');
    expect(sig(12.345)).toBe('12.35');
    expect(sig(null)).toBe('–');
  });
});
