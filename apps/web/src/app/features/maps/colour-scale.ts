/**
 * The maps' colour scale: viridis, perceptually uniform and readable with the common colour
 * vision deficiencies and in grey (van der Walt and Smith, matplotlib's default colour map
 * since 2.0), as nine stops interpolated linearly in sRGB. The stop values are the usual
 * published samples of viridis at 0, 1/8, ..., 1 (from memory).
 */
export const VIRIDIS_STOPS: readonly string[] = [
  '#440154',
  '#472d7b',
  '#3b528b',
  '#2c728e',
  '#21918c',
  '#28ae80',
  '#5ec962',
  '#addc30',
  '#fde725',
];

function rgbOf(hex: string): [number, number, number] {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

const STOPS_RGB = VIRIDIS_STOPS.map(rgbOf);

/** The colour at position `t` of the scale (clamped to 0..1), as `rgb(r, g, b)`. */
export function viridis(t: number): string {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0)) * (STOPS_RGB.length - 1);
  const i = Math.min(STOPS_RGB.length - 2, Math.floor(x));
  const f = x - i;
  const a = STOPS_RGB[i]!;
  const b = STOPS_RGB[i + 1]!;
  const c = (k: number) => Math.round(a[k]! + (b[k]! - a[k]!) * f);
  return `rgb(${c(0)}, ${c(1)}, ${c(2)})`;
}

/** A value range the colours span; a zero-width range is widened so every value has a colour. */
export interface ColourRange {
  min: number;
  max: number;
}

/** Position of `value` on `range`, 0..1 (0.5 for a range of one value). */
export function scalePosition(value: number, range: ColourRange): number {
  const span = range.max - range.min;
  if (!(span > 0)) return 0.5;
  return Math.min(1, Math.max(0, (value - range.min) / span));
}

/** Relative luminance of a `rgb(r, g, b)` or `#rrggbb` colour (WCAG 2.x definition). */
export function relativeLuminance(colour: string): number {
  const rgb = colour.startsWith('#')
    ? rgbOf(colour)
    : (colour.match(/\d+/g) ?? ['0', '0', '0']).slice(0, 3).map(Number);
  const lin = rgb.map((v) => {
    const s = v / 255;
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * lin[0]! + 0.7152 * lin[1]! + 0.0722 * lin[2]!;
}
