/**
 * A map sweep's stored points grouped into maps: readings grouped into temperature steps, each
 * step's readings grouped by site and averaged, and the uniformity of the sites not excluded.
 * Plain functions of the stored rows, so the grouping is tested without a database.
 */
import type { MapAtTemperatureDto, MapSiteDto, MapStatisticsDto } from '@rhotrace/api-types';
import { mapUniformity } from '@rhotrace/physics';
import { badRequest } from '../errors';

/**
 * Readings within this many kelvin of a step's first (coolest) reading belong to that step. A
 * map is measured at set points: the chuck holds each while the probe visits every site, so the
 * sites of one step differ by the controller's wander (a few tenths of a kelvin), far less than
 * the spacing of set points (product choice, common practice, no source).
 */
export const MAP_STEP_TOLERANCE_K = 1;

/** One stored point of a map sweep, as the grouping needs it. */
export interface MapPointRow {
  temperatureK: number;
  resistivityOhmCm: number;
  sheetResistanceOhmSq: number | null;
  siteXMm: number;
  siteYMm: number;
  siteLabel: string | null;
  edgeFactor: number | null;
  flags: readonly string[];
}

/** How a site is named in a `site` option: its label, else `x,y` in mm. */
export function siteName(site: { xMm: number; yMm: number; label: string | null }): string {
  return site.label ?? `${site.xMm},${site.yMm}`;
}

/** Two readings are at one site when their coordinates agree to a micrometre. */
function siteKey(x: number, y: number): string {
  return `${Math.round(x * 1000)}:${Math.round(y * 1000)}`;
}

const meanOf = (values: readonly number[]) => values.reduce((a, b) => a + b, 0) / values.length;

/** The sites of one step, each site's readings averaged. */
function sitesOf(rows: readonly MapPointRow[]): MapSiteDto[] {
  const groups = new Map<string, MapPointRow[]>();
  for (const r of rows) {
    const key = siteKey(r.siteXMm, r.siteYMm);
    const list = groups.get(key);
    if (list) list.push(r);
    else groups.set(key, [r]);
  }
  const sites = [...groups.values()].map((g) => {
    const first = g[0]!;
    const sheets = g.map((r) => r.sheetResistanceOhmSq);
    return {
      xMm: first.siteXMm,
      yMm: first.siteYMm,
      label: first.siteLabel,
      sheetResistanceOhmSq: sheets.every((v) => v !== null) ? meanOf(sheets as number[]) : null,
      resistivityOhmCm: meanOf(g.map((r) => r.resistivityOhmCm)),
      edgeFactor: meanOf(g.map((r) => r.edgeFactor ?? 1)),
      excluded: g.some((r) => r.flags.includes('edge-exclusion')),
      readingCount: g.length,
    };
  });
  return sites.sort(bySiteOrder);
}

/** A whole-number label, or null. */
function labelNumber(label: string | null): number | null {
  return label !== null && /^\d+$/.test(label) ? Number(label) : null;
}

/**
 * Sites in reading order: numbered labels (pattern sites) by number first, the rest by rows
 * from +y down, each row from -x, as a map is read.
 */
function bySiteOrder(a: MapSiteDto, b: MapSiteDto): number {
  const na = labelNumber(a.label);
  const nb = labelNumber(b.label);
  if (na !== null || nb !== null) return (na ?? Infinity) - (nb ?? Infinity);
  return b.yMm - a.yMm || a.xMm - b.xMm;
}

/** Uniformity of the sites not excluded; null when every site is excluded. */
export function statisticsOf(sites: readonly MapSiteDto[]): MapStatisticsDto | null {
  const counted = sites.filter((s) => !s.excluded);
  if (!counted.length) return null;
  const u = mapUniformity(
    counted.map((s) => ({ xMm: s.xMm, yMm: s.yMm, value: s.resistivityOhmCm })),
  );
  return {
    count: u.count,
    meanOhmCm: u.mean,
    stdDevOhmCm: u.stdDev,
    stdDevPercent: u.stdDevPercent,
    minOhmCm: u.min,
    maxOhmCm: u.max,
    rangePercent: u.rangePercent,
    radialSlopePercentPerMm: u.radialSlopePercentPerMm,
  };
}

/** The maps of a sweep, one per temperature step (coolest first). */
export function mapsOf(rows: readonly MapPointRow[]): MapAtTemperatureDto[] {
  const sorted = [...rows].sort((a, b) => a.temperatureK - b.temperatureK);
  const maps: MapAtTemperatureDto[] = [];
  let start = 0;
  while (start < sorted.length) {
    const first = sorted[start]!.temperatureK;
    let end = start + 1;
    while (end < sorted.length && sorted[end]!.temperatureK - first < MAP_STEP_TOLERANCE_K) end++;
    const step = sorted.slice(start, end);
    const sites = sitesOf(step);
    maps.push({
      temperatureK: meanOf(step.map((r) => r.temperatureK)),
      sites,
      statistics: statisticsOf(sites),
    });
    start = end;
  }
  return maps;
}

/**
 * The readings a map gives the temperature analyses: per step, one per site not excluded, at
 * the step's mean temperature (so a step's mean is the map mean), sorted by temperature.
 */
export function mapReadings(
  maps: readonly MapAtTemperatureDto[],
): Array<{ temperatureK: number; resistivityOhmCm: number }> {
  return maps.flatMap((m) =>
    m.sites
      .filter((s) => !s.excluded)
      .map((s) => ({ temperatureK: m.temperatureK, resistivityOhmCm: s.resistivityOhmCm })),
  );
}

/**
 * One reading per step for the temperature analyses: the map mean (the mean over the sites not
 * excluded) or, with `site`, that site's averaged value. Steps where the site is missing or
 * every site is excluded give no reading.
 */
export function mapSeries(
  maps: readonly MapAtTemperatureDto[],
  site: string | null,
): Array<{ temperatureK: number; resistivityOhmCm: number }> {
  const out: Array<{ temperatureK: number; resistivityOhmCm: number }> = [];
  for (const m of maps) {
    if (site === null) {
      if (m.statistics)
        out.push({ temperatureK: m.temperatureK, resistivityOhmCm: m.statistics.meanOhmCm });
      continue;
    }
    const s = m.sites.find((x) => siteName(x) === site);
    if (s) out.push({ temperatureK: m.temperatureK, resistivityOhmCm: s.resistivityOhmCm });
  }
  return out;
}

/**
 * The readings of one site of a map (its averaged value per step); a 400 naming `site` when
 * the sweep is no map or has no such site.
 */
export function siteReadings(
  maps: readonly MapAtTemperatureDto[] | null,
  site: string,
): Array<{ temperatureK: number; resistivityOhmCm: number }> {
  if (!maps) {
    throw badRequest('This sweep is not a map', [
      { field: 'site', problem: 'only a map sweep has sites; leave site out' },
    ]);
  }
  const points = mapSeries(maps, site);
  if (!points.length) {
    const known = [...new Set(maps.flatMap((m) => m.sites.map(siteName)))].slice(0, 10);
    throw badRequest(`The map has no site "${site}"`, [
      { field: 'site', problem: `is not a site of this map (sites include ${known.join(', ')})` },
    ]);
  }
  return points;
}
