import { relativeLuminance, scalePosition, viridis, VIRIDIS_STOPS } from './colour-scale';

describe('the map colour scale', () => {
  it('runs from viridis dark purple to yellow', () => {
    // Viridis end points #440154 and #fde725 (matplotlib's viridis, from memory).
    expect(viridis(0)).toBe('rgb(68, 1, 84)');
    expect(viridis(1)).toBe('rgb(253, 231, 37)');
    expect(viridis(-3)).toBe(viridis(0));
    expect(viridis(Number.NaN)).toBe(viridis(0));
  });

  it('rises in luminance all the way, so it reads in grey and with colour-blind vision', () => {
    // A perceptually ordered scale is monotonic in lightness (van der Walt and Smith, viridis);
    // the WCAG relative luminance of the samples must rise at every step.
    let previous = -1;
    for (let i = 0; i <= 64; i++) {
      const l = relativeLuminance(viridis(i / 64));
      expect(l).toBeGreaterThan(previous);
      previous = l;
    }
    expect(relativeLuminance(VIRIDIS_STOPS[0]!)).toBeLessThan(0.05);
  });

  it('places values on a range, clamping outside it and centring a range of one value', () => {
    expect(scalePosition(15, { min: 10, max: 20 })).toBe(0.5);
    expect(scalePosition(25, { min: 10, max: 20 })).toBe(1);
    expect(scalePosition(7, { min: 7, max: 7 })).toBe(0.5);
  });
});
