import { describe, expect, it } from 'vitest';
import { patternSiteMm, SITE_PATTERNS, SITE_PATTERN_IDS } from './site-patterns';

describe('site patterns', () => {
  it('have the site counts their names say, numbered from 1, all inside the usable radius', () => {
    for (const id of SITE_PATTERN_IDS) {
      const sites = SITE_PATTERNS[id];
      expect(sites.length).toBe(Number(id.split('-')[1]));
      sites.forEach((s, i) => {
        expect(s.number).toBe(i + 1);
        expect(Math.hypot(s.xFraction, s.yFraction)).toBeLessThanOrEqual(1);
      });
      const places = new Set(
        sites.map((s) => `${s.xFraction.toFixed(6)},${s.yFraction.toFixed(6)}`),
      );
      expect(places.size).toBe(sites.length);
    }
  });

  it('scales a site by the usable radius', () => {
    expect(patternSiteMm('centre-5', 2, 72)).toEqual({ xMm: 36, yMm: 0, label: '2' });
    // grid-49: site 1 is the corner at -x, +y: (-3, 3) pitches of 0.23 usable radii.
    const corner = patternSiteMm('grid-49', 1, 100);
    expect(corner.xMm).toBeCloseTo(-69, 9);
    expect(corner.yMm).toBeCloseTo(69, 9);
    expect(patternSiteMm('grid-49', 25, 100)).toEqual({ xMm: 0, yMm: 0, label: '25' });
  });

  it('refuses a site number the pattern lacks', () => {
    expect(() => patternSiteMm('ring-9', 10, 50)).toThrow(/`patternSiteMm`.*siteNumber/);
    expect(() => patternSiteMm('ring-9', 1.5, 50)).toThrow(/whole siteNumber/);
  });
});
