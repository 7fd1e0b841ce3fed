/**
 * Rhotrace's own site patterns for wafer maps: where each numbered site of a named pattern
 * lies, as fractions of the usable radius (the wafer radius less the edge exclusion), so every
 * pattern site lies inside the area the statistics count.
 *
 * Axes: x to the right, y away from the flat or notch (which sits at -y), origin at the wafer
 * centre; angles counter-clockwise from +x. Sites are numbered from 1.
 * - `centre-5`: the centre, then 4 sites at 0.5 on +x, +y, -x, -y.
 * - `ring-9`: the centre, then 8 sites at 0.8 every 45 degrees from +x.
 * - `ring-25`: the centre, 8 sites at 0.45 every 45 degrees from +x, then 16 at 0.9 every
 *   22.5 degrees from +x.
 * - `grid-49`: a 7 x 7 square grid of pitch 0.23 (the corners at 0.976), numbered by rows from
 *   the row farthest from the flat, each row from -x to +x.
 * These are the product's choice (common practice, no source): they follow the trade's habit
 * of a centre site with rings or a square grid, not any standard's site list.
 */
import { PhysicsInputError } from '../errors';
import { requireInRange, requireOneOf, requirePositive } from '../validate';

/** The names of the patterns. */
export const SITE_PATTERN_IDS = ['centre-5', 'ring-9', 'ring-25', 'grid-49'] as const;
export type SitePatternId = (typeof SITE_PATTERN_IDS)[number];

/** One site of a pattern, in fractions of the usable radius. */
export interface PatternSite {
  number: number;
  label: string;
  xFraction: number;
  yFraction: number;
}

/** The grid pitch of `grid-49`, in usable radii. */
export const GRID_49_PITCH = 0.23;

function ring(count: number, fraction: number, firstNumber: number): PatternSite[] {
  return Array.from({ length: count }, (_, i) => {
    const angle = (2 * Math.PI * i) / count;
    return site(firstNumber + i, fraction * Math.cos(angle), fraction * Math.sin(angle));
  });
}

function site(n: number, x: number, y: number): PatternSite {
  // Cosines of multiples of 45 degrees leave 1e-17 residues; they are zeros.
  const clean = (v: number) => (Math.abs(v) < 1e-12 ? 0 : v);
  return { number: n, label: String(n), xFraction: clean(x), yFraction: clean(y) };
}

function grid49(): PatternSite[] {
  const sites: PatternSite[] = [];
  for (let row = 3; row >= -3; row--) {
    for (let col = -3; col <= 3; col++) {
      sites.push(site(sites.length + 1, col * GRID_49_PITCH, row * GRID_49_PITCH));
    }
  }
  return sites;
}

const CENTRE = site(1, 0, 0);

/** Every pattern's sites, by name. */
export const SITE_PATTERNS: Readonly<Record<SitePatternId, readonly PatternSite[]>> = {
  'centre-5': [CENTRE, site(2, 0.5, 0), site(3, 0, 0.5), site(4, -0.5, 0), site(5, 0, -0.5)],
  'ring-9': [CENTRE, ...ring(8, 0.8, 2)],
  'ring-25': [CENTRE, ...ring(8, 0.45, 2), ...ring(16, 0.9, 10)],
  'grid-49': grid49(),
};

/**
 * Where site `siteNumber` of `pattern` lies on a wafer whose usable radius is
 * `usableRadiusMm` (wafer radius less edge exclusion).
 *
 * @param pattern one of `SITE_PATTERN_IDS`
 * @param siteNumber 1 to the pattern's site count
 * @param usableRadiusMm mm (> 0)
 * @example patternSiteMm('centre-5', 2, 72) // { xMm: 36, yMm: 0, label: '2' }
 */
export function patternSiteMm(
  pattern: SitePatternId,
  siteNumber: number,
  usableRadiusMm: number,
): { xMm: number; yMm: number; label: string } {
  const fn = 'patternSiteMm';
  const id = requireOneOf(fn, 'pattern', pattern, SITE_PATTERN_IDS);
  const sites = SITE_PATTERNS[id];
  const n = requireInRange(fn, 'siteNumber', siteNumber, 1, sites.length);
  if (!Number.isInteger(n)) {
    throw new PhysicsInputError(fn, 'siteNumber', `requires a whole siteNumber, got ${n}`);
  }
  const r = requirePositive(fn, 'usableRadiusMm', usableRadiusMm);
  const s = sites[n - 1]!;
  return { xMm: s.xFraction * r, yMm: s.yFraction * r, label: s.label };
}
