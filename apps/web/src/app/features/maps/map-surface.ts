/**
 * The interpolated surface drawn under a map's sites: inverse-distance weighting (Shepard 1968,
 * power 2) of the sites not excluded, on a square grid clipped to the usable radius, its values
 * grouped into equal bands so the picture reads as filled contours. It is a picture between
 * the measured sites, not a measurement: the sites and the table hold the measured values.
 */
import type { MapSiteDto } from '@rhotrace/api-types';

/** One cell of the surface: its centre (mm) and interpolated value. */
export interface SurfaceCell {
  xMm: number;
  yMm: number;
  sizeMm: number;
  value: number;
}

/** Bands the surface is drawn in. */
export const SURFACE_BANDS = 12;

/**
 * The value at (x, y) by inverse-distance weighting with power 2: sum w_i v_i / sum w_i with
 * w_i = 1 / d_i^2; a point on a site takes the site's value.
 */
export function inverseDistanceValue(
  xMm: number,
  yMm: number,
  sites: ReadonlyArray<{ xMm: number; yMm: number; value: number }>,
): number {
  let num = 0;
  let den = 0;
  for (const s of sites) {
    const d2 = (s.xMm - xMm) ** 2 + (s.yMm - yMm) ** 2;
    if (d2 < 1e-12) return s.value;
    num += s.value / d2;
    den += 1 / d2;
  }
  return num / den;
}

/**
 * The cells of a `cells` by `cells` grid over the usable disc (radius `usableMm`), each with the
 * band-centre value of its interpolated value between `min` and `max`; none without a site.
 */
export function surfaceCells(
  sites: readonly MapSiteDto[],
  usableMm: number,
  cells: number,
  range: { min: number; max: number },
): SurfaceCell[] {
  const used = sites
    .filter((s) => !s.excluded)
    .map((s) => ({ xMm: s.xMm, yMm: s.yMm, value: s.resistivityOhmCm }));
  if (!used.length || !(usableMm > 0)) return [];
  const size = (2 * usableMm) / cells;
  const span = range.max - range.min;
  const out: SurfaceCell[] = [];
  for (let i = 0; i < cells; i++) {
    for (let j = 0; j < cells; j++) {
      const x = -usableMm + (i + 0.5) * size;
      const y = -usableMm + (j + 0.5) * size;
      // A cell is drawn when any of it lies in the disc; the clip path trims it to the circle.
      if (Math.hypot(Math.abs(x) - size / 2, Math.abs(y) - size / 2) > usableMm) continue;
      const v = inverseDistanceValue(x, y, used);
      const band =
        span > 0
          ? Math.min(SURFACE_BANDS - 1, Math.floor(((v - range.min) / span) * SURFACE_BANDS))
          : 0;
      const value = span > 0 ? range.min + ((band + 0.5) * span) / SURFACE_BANDS : v;
      out.push({ xMm: x, yMm: y, sizeMm: size, value });
    }
  }
  return out;
}
