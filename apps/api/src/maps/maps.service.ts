/**
 * Wafer maps read from stored map sweeps: a sweep's maps at each temperature, and a lot's
 * wafers side by side on one colour scale.
 */
import type {
  LotUniformitySpread,
  WaferUniformity,
  LotMapsResponse,
  LotWaferMapDto,
  MapAtTemperatureDto,
  SessionUser,
  SweepMapInfo,
  SweepMapResponse,
} from '@rhotrace/api-types';
import { SITE_PATTERNS, ZERO_CELSIUS_K, type SitePatternId } from '@rhotrace/physics';
import { Op } from 'sequelize';
import { visibleLot, visibleSweep, visibleWafers } from '../access/visibility.service';
import { notFound } from '../errors';
import { type SweepIdentity, SweepCache } from '../sweeps/sweep-cache';
import { Sweep, SweepPoint } from '../sweeps/sweep.model';
import { Wafer } from '../wafers/wafer.model';
import { mapsOf, type MapPointRow } from './map-data';

/** Wafers from this diameter on carry a notch, smaller ones a flat (common practice, no source). */
export const NOTCH_FROM_DIAMETER_MM = 200;

/** The reference temperature a lot's maps are shown at: 23 °C. */
const REFERENCE_K = ZERO_CELSIUS_K + 23;

/** A map sweep's maps, computed once per stored sweep (points never change once stored). */
const mapsCache = new SweepCache<MapAtTemperatureDto[]>(200_000, (maps) =>
  maps.reduce((n, m) => n + m.sites.length, 0),
);

/** The outline drawn for a wafer of this diameter. */
export function outlineOf(diameterMm: number): 'flat' | 'notch' {
  return diameterMm >= NOTCH_FROM_DIAMETER_MM ? 'notch' : 'flat';
}

/** The map info of a sweep, or null when it is not a map. */
export function mapInfoOf(sweep: Pick<Sweep, 'mapInfo'>): SweepMapInfo | null {
  return (sweep.mapInfo as SweepMapInfo | null) ?? null;
}

/** The maps of a stored map sweep, one per temperature step. */
export async function mapsOfSweep(sweep: SweepIdentity): Promise<MapAtTemperatureDto[]> {
  const hit = mapsCache.get(sweep);
  if (hit) return hit;
  return mapsCache.remember(sweep, mapsOf(await loadMapPointRows(sweep.id)));
}

/** The stored points of a sweep that carry a site, as the map grouping reads them. */
export async function loadMapPointRows(sweepId: number): Promise<MapPointRow[]> {
  const rows = await SweepPoint.findAll({
    attributes: [
      'temperatureK',
      'resistivityOhmCm',
      'sheetResistanceOhmSq',
      'siteXMm',
      'siteYMm',
      'siteLabel',
      'edgeFactor',
      'flags',
    ],
    where: { sweepId },
    raw: true,
  });
  const points: MapPointRow[] = [];
  for (const r of rows) {
    if (r.siteXMm === null || r.siteYMm === null) continue;
    points.push({
      temperatureK: Number(r.temperatureK),
      resistivityOhmCm: Number(r.resistivityOhmCm),
      sheetResistanceOhmSq: r.sheetResistanceOhmSq === null ? null : Number(r.sheetResistanceOhmSq),
      siteXMm: Number(r.siteXMm),
      siteYMm: Number(r.siteYMm),
      siteLabel: r.siteLabel,
      edgeFactor: r.edgeFactor === null ? null : Number(r.edgeFactor),
      flags: r.flags ? r.flags.split(',') : [],
    });
  }
  return points;
}

/** `GET /api/sweeps/:id/map`: 404 for a hidden sweep or one that is not a map. */
export async function sweepMap(user: SessionUser, sweepId: number): Promise<SweepMapResponse> {
  const { sweep } = await visibleSweep(user, sweepId);
  const info = mapInfoOf(sweep);
  if (!info) throw notFound(`A map of sweep ${sweepId} (its points carry no sites)`);
  const maps = await mapsOfSweep(sweep);
  const patternId = info.pattern as SitePatternId | null;
  const usableMm = info.diameterMm / 2 - info.edgeExclusionMm;
  return {
    sweepId: sweep.id,
    waferId: sweep.waferId,
    map: info,
    outline: outlineOf(info.diameterMm),
    pattern:
      patternId && SITE_PATTERNS[patternId]
        ? {
            id: patternId,
            sites: SITE_PATTERNS[patternId].map((s) => ({
              number: s.number,
              label: s.label,
              xMm: s.xFraction * usableMm,
              yMm: s.yFraction * usableMm,
            })),
          }
        : null,
    temperaturesK: maps.map((m) => m.temperatureK),
    maps,
  };
}

/** The map of `maps` nearest `temperatureK`. */
export function nearestMap(
  maps: readonly MapAtTemperatureDto[],
  temperatureK: number,
): MapAtTemperatureDto | null {
  let best: MapAtTemperatureDto | null = null;
  for (const m of maps) {
    if (
      !best ||
      Math.abs(m.temperatureK - temperatureK) < Math.abs(best.temperatureK - temperatureK)
    )
      best = m;
  }
  return best;
}

/** A map sweep's uniformity at the step nearest 23 °C; null for a sweep that is no map. */
export async function waferUniformity(
  sweep: SweepIdentity & Pick<Sweep, 'mapInfo'>,
): Promise<WaferUniformity | null> {
  if (!mapInfoOf(sweep)) return null;
  const at = nearestMap(await mapsOfSweep(sweep), REFERENCE_K);
  if (!at?.statistics) return null;
  return {
    temperatureK: at.temperatureK,
    siteCount: at.statistics.count,
    stdDevPercent: at.statistics.stdDevPercent,
    rangePercent: at.statistics.rangePercent,
  };
}

/**
 * The spread of the map wafers' uniformities over a lot: mean, extremes and sample standard
 * deviation of their stdDevPercent; null when no wafer has one.
 */
export function lotUniformitySpread(
  rows: ReadonlyArray<{ uniformity?: WaferUniformity | null }>,
): LotUniformitySpread | null {
  const values = rows.flatMap((r) =>
    r.uniformity?.stdDevPercent == null ? [] : [r.uniformity.stdDevPercent],
  );
  if (!values.length) return null;
  const n = values.length;
  const mean = values.reduce((a, b) => a + b, 0) / n;
  const ss = values.reduce((a, v) => a + (v - mean) ** 2, 0);
  return {
    count: n,
    meanStdDevPercent: mean,
    minStdDevPercent: Math.min(...values),
    maxStdDevPercent: Math.max(...values),
    stdDevOfStdDevPercent: n > 1 ? Math.sqrt(ss / (n - 1)) : null,
  };
}

/**
 * `GET /api/lots/:id/maps`: every visible wafer's newest map sweep at the step nearest 23 °C,
 * and one colour scale over all of them (from the sites not excluded: an excluded edge site
 * would stretch the scale; it is drawn at the scale's end).
 */
export async function lotMaps(user: SessionUser, lotId: number): Promise<LotMapsResponse> {
  await visibleLot(user, lotId);
  const wafers = await Wafer.findAll({
    where: { [Op.and]: [{ lotId }, visibleWafers(user)] },
    order: [['number', 'ASC']],
  });
  const sweeps = wafers.length
    ? await Sweep.findAll({
        where: { waferId: wafers.map((w) => w.id), mapInfo: { [Op.ne]: null } },
        order: [
          ['createdAt', 'DESC'],
          ['id', 'DESC'],
        ],
      })
    : [];
  const out: LotWaferMapDto[] = [];
  let min = Infinity;
  let max = -Infinity;
  for (const wafer of wafers) {
    const sweep = sweeps.find((s) => s.waferId === wafer.id);
    const info = sweep ? mapInfoOf(sweep) : null;
    if (!sweep || !info) continue;
    const at = nearestMap(await mapsOfSweep(sweep), REFERENCE_K);
    if (!at) continue;
    for (const s of at.sites) {
      if (s.excluded) continue;
      min = Math.min(min, s.resistivityOhmCm);
      max = Math.max(max, s.resistivityOhmCm);
    }
    out.push({
      waferId: wafer.id,
      waferNumber: wafer.number,
      sweepId: sweep.id,
      map: info,
      outline: outlineOf(info.diameterMm),
      atTemperature: at,
    });
  }
  return {
    lotId,
    scale: Number.isFinite(min) ? { minOhmCm: min, maxOhmCm: max } : null,
    wafers: out,
  };
}
