import { describe, expect, it } from 'vitest';
import {
  axisPrefix,
  decadeLabel,
  decadeTicks,
  logRoundTicks,
  niceStep,
  niceTicks,
  tickLabel,
} from './pdf-axes';
import { geometryText, openPdf, plain, sig } from './pdf-document';
import { drawAxes } from './pdf-plot';

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
    // nine decades labelled every second one: the axis ends on 10^16, not a crowded 10^15
    expect(decadeTicks(1e6, 1e15)).toEqual([6, 8, 10, 12, 14, 16]);
    expect(logRoundTicks(20, 400)).toEqual([20, 50, 100, 200, 500]);
    expect(logRoundTicks(2, 700)).toEqual([2, 10, 100, 1000]);
    expect(decadeLabel(-1)).toEqual({ base: '0.1', exponent: null });
    expect(decadeLabel(3)).toEqual({ base: '1000', exponent: null });
    expect(decadeLabel(-6)).toEqual({ base: '10', exponent: '−6' });
  });
});

describe('printed geometry and numbers', () => {
  it('read as words in the units a lab uses, never the stored names', () => {
    const text = geometryText({ thicknessCm: 0.0525, diameterCm: 15, spacingCm: 0.1 });
    // as entered, without padding zeros that would claim a precision nobody measured
    expect(text).toBe('thickness 525 µm, diameter 150 mm, probe spacing 1 mm');
    expect(geometryText({ thicknessCm: 0.00001985 })).toBe('thickness 0.1985 µm');
    expect(text).not.toMatch(/Cm\b/);
  });

  it('write very small and large values as powers of ten', () => {
    expect(sig(2.5e15, 3)).toBe('2.50 × 10^15');
    expect(sig(12.345)).toBe('12.35');
    expect(sig(1440, 3)).toBe('1440');
    expect(sig(-23456, 2)).toBe('-23000');
    expect(sig(null)).toBe('–');
    expect(plain(0.000005, 6)).toBe('5 × 10^-6');
    expect(plain(12, 6)).toBe('12');
    expect(plain(0.0525, 6)).toBe('0.0525');
  });
});

describe('printed linear axes', () => {
  it('label ticks with the decimals their step needs, never float noise', () => {
    expect(niceTicks(9.5, 10.6).map((t) => tickLabel(t, 0.2))).toEqual([
      '9.4',
      '9.6',
      '9.8',
      '10.0',
      '10.2',
      '10.4',
      '10.6',
    ]);
    expect(tickLabel(300, 100)).toBe('300');
  });

  it('write µΩ·cm or kΩ·cm in the title instead of six zeros in every label', () => {
    // SI prefixes in steps of 10^3 (BIPM SI Brochure, 9th ed., 3.1); labels of 4 to 14 µΩ·cm.
    expect(axisPrefix(1.4e-5)).toEqual({ factor: 1e-6, prefix: 'µ' });
    expect(axisPrefix(0.005)).toEqual({ factor: 1e-3, prefix: 'm' });
    expect(axisPrefix(16)).toEqual({ factor: 1, prefix: '' });
    expect(axisPrefix(2.5e4)).toEqual({ factor: 1e3, prefix: 'k' });
  });

  it('set long wafer names upright, so they cannot run into each other, and leave room below', () => {
    const { doc } = openPdf({});
    const box = { x0: 100, y0: 100, width: 420, height: 180 };
    const chart = (names: string[]) =>
      drawAxes(doc, box, {
        xTicks: names.map((label, i) => ({ value: i + 1, label })),
        xTitle: 'Wafer',
        yMin: 1,
        yMax: 2,
        yLog: false,
        yTitle: 'ρ at 23 °C',
        yUnit: 'Ω·cm',
      }).bottom;
    const short = chart(Array.from({ length: 25 }, (_, i) => `W${i + 1}`));
    const long = chart(Array.from({ length: 25 }, (_, i) => `LV-26-B014-W${i + 1}`));
    // level labels: one 7 pt line under the axis; upright ones: their length (about 48 pt)
    expect(short).toBeLessThan(box.y0 + box.height + 35);
    expect(long - short).toBeGreaterThan(30);
  });
});
