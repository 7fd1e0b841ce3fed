import type { AnalysisStep, MapAtTemperatureDto, PointQuantities } from '@rhotrace/api-types';
import { FIT_EXCLUDED_FLAGS } from '@rhotrace/api-types';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { type SweepIdentity, SweepCache } from '../sweeps/sweep-cache';
import { SweepPoint } from '../sweeps/sweep.model';
import { mapReadings, mapsOf, siteReadings } from '../maps/map-data';
import { loadMapPointRows } from '../maps/maps.service';

/**
 * Readings closer than this to the first reading of a step belong to the same temperature
 * step, K. A sweep that dwells at each set point gives one step per set point; a continuous ramp
 * gives steps a quarter kelvin wide.
 */
export const STEP_TOLERANCE_K = 0.25;

/** One reading as the analysis uses it. */
export interface AnalysisPoint {
  temperatureK: number;
  resistivityOhmCm: number;
  /** Quantities beyond resistivity (Hall sweeps: density, mobility); absent for most sweeps. */
  quantities?: PointQuantities;
}

/** The readings of a sweep usable for analysis, sorted by temperature. */
export interface SweepReadings {
  points: AnalysisPoint[];
  /** Readings left out: resistivity not finite or not positive. */
  skipped: number;
}

interface CachedReadings {
  /** Usable readings sorted by temperature. */
  points: AnalysisPoint[];
  /** Sequence number of each of `points`, and whether it carries a `FIT_EXCLUDED_FLAGS` flag. */
  sequences: Int32Array;
  excludable: Uint8Array;
  /** Ramp leg of each of `points` (0 on sweeps imported before legs: one leg). */
  legs: Int16Array;
  /** Temperatures of the readings left out (finite ones only), sorted. */
  skippedK: number[];
  /** Readings left out whose temperature is not finite (in no window). */
  skippedNoTemperature: number;
  /** A map sweep's maps (its points carry sites), else null. */
  maps: MapAtTemperatureDto[] | null;
}

/** Readings kept across all cached sweeps (about 60 bytes each). */
export const READINGS_CACHE_LIMIT = 1_000_000;
/**
 * Readings of recently analysed sweeps: each sweep's points are read from the database once.
 * One sweep may fill the whole cache: reading a sweep from the largest files the upload takes
 * (20 MB, about 600,000 readings) costs seconds, and a study asks for it again at every leg,
 * window or fit, so it is kept even if it pushes the others out.
 */
const readingsCache = new SweepCache<CachedReadings>(
  READINGS_CACHE_LIMIT,
  (r) => r.points.length + r.skippedK.length,
  1,
);

async function loadReadings(sweep: SweepIdentity): Promise<CachedReadings> {
  const hit = readingsCache.get(sweep);
  if (hit) return hit;
  const rows = await SweepPoint.findAll({
    attributes: [
      'sequence',
      'temperatureK',
      'resistivityOhmCm',
      'flags',
      'quantities',
      'leg',
      'siteXMm',
      'siteYMm',
    ],
    where: { sweepId: sweep.id },
    raw: true,
  });
  if (rows.some((r) => r.siteXMm !== null)) return loadMapReadings(sweep);
  const usable: Array<{
    point: AnalysisPoint;
    sequence: number;
    excludable: boolean;
    leg: number;
  }> = [];
  const skippedK: number[] = [];
  let skippedNoTemperature = 0;
  for (const r of rows) {
    const t = Number(r.temperatureK);
    const rho = Number(r.resistivityOhmCm);
    if (Number.isFinite(t) && t > 0 && Number.isFinite(rho) && rho > 0) {
      const flags = r.flags ? r.flags.split(',') : [];
      const point: AnalysisPoint = { temperatureK: t, resistivityOhmCm: rho };
      if (r.quantities) point.quantities = storedQuantities(r.quantities);
      usable.push({
        point,
        sequence: Number(r.sequence),
        excludable: FIT_EXCLUDED_FLAGS.some((f) => flags.includes(f)),
        leg: Number(r.leg ?? 0),
      });
    } else if (Number.isFinite(t)) {
      skippedK.push(t);
    } else {
      skippedNoTemperature += 1;
    }
  }
  // Stable sort by temperature, then by the order the readings were taken.
  usable.sort((a, b) => a.point.temperatureK - b.point.temperatureK || a.sequence - b.sequence);
  skippedK.sort((a, b) => a - b);
  return readingsCache.remember(sweep, {
    points: usable.map((u) => u.point),
    sequences: Int32Array.from(usable, (u) => u.sequence),
    excludable: Uint8Array.from(usable, (u) => (u.excludable ? 1 : 0)),
    legs: Int16Array.from(usable, (u) => u.leg),
    skippedK,
    skippedNoTemperature,
    maps: null,
  });
}

/**
 * A map sweep's readings: per temperature step, one reading per site not excluded, at the
 * step's mean temperature, so that a step's mean is the map mean and its spread the
 * site-to-site spread (the 23 °C value's repeatability is then the standard error of the site
 * mean). Sites in the edge exclusion are left out, as from the map statistics.
 */
async function loadMapReadings(sweep: SweepIdentity): Promise<CachedReadings> {
  const maps = mapsOf(await loadMapPointRows(sweep.id));
  const readings = mapReadings(maps);
  return readingsCache.remember(sweep, {
    points: readings,
    sequences: new Int32Array(readings.length),
    excludable: new Uint8Array(readings.length),
    legs: new Int16Array(readings.length),
    skippedK: [],
    skippedNoTemperature: 0,
    maps,
  });
}

/** A stored quantities document, as text from a raw read. */
function storedQuantities(stored: unknown): PointQuantities {
  return (typeof stored === 'string' ? JSON.parse(stored) : stored) as PointQuantities;
}

/** Readings a fit uses, and the flagged ones it left out. */
export interface FitReadings {
  /** Usable readings sorted by temperature, flagged ones left out unless included. */
  points: AnalysisPoint[];
  /** Temperature and sequence number of each flagged reading left out, sorted by temperature. */
  excluded: Array<{ sequence: number; temperatureK: number }>;
}

/**
 * A sweep's readings for a fit: as `sweepReadings` without a window, but readings carrying a
 * `FIT_EXCLUDED_FLAGS` flag are left out (and listed) unless `includeFlagged`.
 */
export async function sweepFitReadings(
  sweep: SweepIdentity,
  includeFlagged: boolean,
  leg: number | null = null,
  site: string | null = null,
): Promise<FitReadings> {
  const cached = await loadReadings(sweep);
  if (site !== null) return { points: siteReadings(cached.maps, site), excluded: [] };
  const inLeg = (i: number) => leg === null || cached.legs[i] === leg;
  if (includeFlagged) return { points: cached.points.filter((_, i) => inLeg(i)), excluded: [] };
  const points: AnalysisPoint[] = [];
  const excluded: FitReadings['excluded'] = [];
  cached.points.forEach((p, i) => {
    if (!inLeg(i)) return;
    if (cached.excludable[i]) {
      excluded.push({ sequence: cached.sequences[i]!, temperatureK: p.temperatureK });
    } else {
      points.push(p);
    }
  });
  return { points, excluded };
}

/** A usable reading with its sequence, leg and whether a fit leaves it out by default. */
export type LegReading = AnalysisPoint & { sequence: number; leg: number; excludable: boolean };

/** Each cached sweep's readings with their legs, built once: a cache entry never changes. */
const legReadingsOf = new WeakMap<CachedReadings, readonly LegReading[]>();

/** Each usable reading with its leg; shared while the sweep is cached: never change it. */
export async function legReadings(sweep: SweepIdentity): Promise<readonly LegReading[]> {
  const c = await loadReadings(sweep);
  let list = legReadingsOf.get(c);
  if (!list) {
    list = c.points.map((p, i) => {
      const r: LegReading = {
        temperatureK: p.temperatureK,
        resistivityOhmCm: p.resistivityOhmCm,
        sequence: c.sequences[i]!,
        leg: c.legs[i]!,
        excludable: c.excludable[i] === 1,
      };
      if (p.quantities) r.quantities = p.quantities;
      return r;
    });
    legReadingsOf.set(c, list);
  }
  return list;
}

/** The first index in 0..n at which `pred` holds (it must hold from some index on), or n. */
function firstIndex(n: number, pred: (i: number) => boolean): number {
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (pred(mid)) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/**
 * A sweep's usable readings (temperature and resistivity), sorted by temperature; with a
 * window, only those with minK <= T <= maxK (inclusive). `skipped` counts the readings left
 * out (resistivity or temperature not finite or not positive), within the window when one is
 * given.
 */
export async function sweepReadings(
  sweep: SweepIdentity,
  window?: { minK: number; maxK: number },
  site: string | null = null,
): Promise<SweepReadings> {
  const loaded = await loadReadings(sweep);
  const cached =
    site === null ? loaded : { ...loaded, points: siteReadings(loaded.maps, site), skippedK: [] };
  if (!window) {
    return {
      points: cached.points.slice(),
      skipped: cached.skippedK.length + cached.skippedNoTemperature,
    };
  }
  const pts = cached.points;
  const from = firstIndex(pts.length, (i) => pts[i]!.temperatureK >= window.minK);
  const to = firstIndex(pts.length, (i) => pts[i]!.temperatureK > window.maxK);
  const sk = cached.skippedK;
  const skipped =
    firstIndex(sk.length, (i) => sk[i]! > window.maxK) -
    firstIndex(sk.length, (i) => sk[i]! >= window.minK);
  return { points: pts.slice(from, Math.max(from, to)), skipped: Math.max(0, skipped) };
}

/**
 * Groups temperature-sorted readings into steps (see `STEP_TOLERANCE_K`) and averages each:
 * mean temperature, mean resistivity and the sample standard deviation (0 for one reading).
 */
export function averageSteps(points: readonly AnalysisPoint[]): AnalysisStep[] {
  const steps: AnalysisStep[] = [];
  let start = 0;
  while (start < points.length) {
    const first = points[start]!.temperatureK;
    let end = start + 1;
    while (end < points.length && points[end]!.temperatureK - first < STEP_TOLERANCE_K) end += 1;
    const group = points.slice(start, end);
    const rhos = group.map((p) => p.resistivityOhmCm);
    steps.push({
      temperatureK: mean(group.map((p) => p.temperatureK)),
      resistivityOhmCm: mean(rhos),
      spreadOhmCm: rhos.length > 1 ? sampleStandardDeviation(rhos) : 0,
      count: group.length,
    });
    start = end;
  }
  return steps;
}

/** Each cached sweep's steps over all its usable readings, averaged once. */
const stepsOf = new WeakMap<CachedReadings, readonly AnalysisStep[]>();

/**
 * `averageSteps` of all a sweep's usable readings, averaged once while the sweep is cached (the
 * study page and the wafer's 23 °C value ask on every visit); shared: never change it.
 */
export async function sweepSteps(sweep: SweepIdentity): Promise<readonly AnalysisStep[]> {
  const c = await loadReadings(sweep);
  let steps = stepsOf.get(c);
  if (!steps) {
    steps = averageSteps(c.points);
    stepsOf.set(c, steps);
  }
  return steps;
}

/** Points with minK <= T <= maxK (inclusive, as the physics library's windows are). */
export function pointsInWindow(
  points: readonly AnalysisPoint[],
  minK: number,
  maxK: number,
): AnalysisPoint[] {
  return points.filter((p) => p.temperatureK >= minK && p.temperatureK <= maxK);
}
