import { describe, expect, it } from 'vitest';
import {
  PALETTE_DARK,
  PALETTE_LIGHT,
  PLOT_BACKGROUND,
  PLOT_ROLES,
  schemeColour,
  seriesColour,
} from './palette';

/**
 * Dichromat simulation matrices on linear sRGB, severity 1: Machado, Oliveira & Fernandes,
 * "A physiologically-based model for simulation of color vision deficiency", IEEE TVCG 15,
 * 1291 (2009), table of severity 1.0 (from memory).
 */
const SIMULATIONS: Record<string, number[][]> = {
  normal: [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ],
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
  tritanopia: [
    [1.255528, -0.076749, -0.178779],
    [-0.078411, 0.930809, 0.147602],
    [0.004733, 0.691367, 0.3039],
  ],
};

/** sRGB transfer function inverted (IEC 61966-2-1). */
function linear(hex: string): number[] {
  return [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
}

/** CIELAB (D65) of linear sRGB, CIE 15:2004. */
function lab(rgb: number[]): number[] {
  const [r, g, b] = rgb.map((v) => Math.min(1, Math.max(0, v))) as [number, number, number];
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > 0.008856 ? Math.cbrt(t) : 7.787 * t + 16 / 116);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}

/** WCAG 2.1 contrast ratio from relative luminance. */
function contrast(a: string, b: string): number {
  const lum = (hex: string) => {
    const [r, g, bl] = linear(hex) as [number, number, number];
    return 0.2126 * r + 0.7152 * g + 0.0722 * bl;
  };
  const [hi, lo] = [lum(a), lum(b)].sort((p, q) => q - p) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

function smallestDifference(palette: readonly string[], matrix: number[][]): number {
  const seen = palette.map((hex) => {
    const rgb = linear(hex);
    return lab(matrix.map((row) => row.reduce((s, m, j) => s + m * rgb[j]!, 0)));
  });
  let smallest = Infinity;
  for (let i = 0; i < seen.length; i++)
    for (let j = i + 1; j < seen.length; j++)
      smallest = Math.min(smallest, Math.hypot(...seen[i]!.map((v, k) => v - seen[j]![k]!)));
  return smallest;
}

describe('the plot palette', () => {
  // A CIE76 difference of about 2.3 is just noticeable (Sharma, Digital Color Imaging
  // Handbook, 2003); 20 keeps series apart at a glance, for marker-sized areas too (common
  // practice, no source).
  for (const [scheme, palette] of [
    ['light', PALETTE_LIGHT],
    ['dark', PALETTE_DARK],
  ] as const) {
    for (const [vision, matrix] of Object.entries(SIMULATIONS)) {
      it(`keeps every ${scheme} pair 20 CIELAB units apart with ${vision} vision`, () => {
        expect(smallestDifference(palette, matrix)).toBeGreaterThan(20);
      });
    }

    it(`gives every ${scheme} colour 3:1 contrast against the plot background`, () => {
      for (const colour of palette) {
        expect(contrast(colour, PLOT_BACKGROUND[scheme])).toBeGreaterThanOrEqual(3);
      }
    });
  }

  it('maps each light colour to its dark counterpart and leaves others alone', () => {
    expect(schemeColour(PLOT_ROLES.measured, true)).toBe(PALETTE_DARK[0]);
    expect(schemeColour(seriesColour(7), true)).toBe(PALETTE_DARK[1]);
    expect(schemeColour(PLOT_ROLES.fit, false)).toBe(PLOT_ROLES.fit);
    expect(schemeColour('rgba(0,0,0,0.2)', true)).toBe('rgba(0,0,0,0.2)');
  });

  it('tells a simulated confusion pair apart from a distinguishable one (the check can fail)', () => {
    // Red and green of equal lightness collapse for a deuteranope (Machado 2009): the check
    // must report them as nearly the same colour.
    expect(smallestDifference(['#B35900', '#4D8000'], SIMULATIONS['deuteranopia']!)).toBeLessThan(
      20,
    );
  });
});
