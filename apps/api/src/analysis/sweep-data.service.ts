import type { AnalysisStep, SessionUser, AnalysisSweepDto } from '@rhotrace/api-types';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { Op } from 'sequelize';
import { asNotFound, notFound } from '../errors';
import type { Lot } from '../lots/lot.model';
import { Sweep, SweepPoint } from '../sweeps/sweep.model';
import type { Wafer } from '../wafers/wafer.model';
import { visibleWafer } from '../wafers/wafer-access.service';

/**
 * Readings closer than this to the first reading of a step belong to the same temperature
 * step, K. A sweep that dwells at each set point gives one step per set point; a continuous ramp
 * gives steps a quarter kelvin wide.
 */
export const STEP_TOLERANCE_K = 0.25;

/** A sweep with the wafer and lot it belongs to, already checked for visibility. */
export interface VisibleSweep {
  sweep: Sweep;
  wafer: Wafer;
  lot: Lot;
}

/** One reading as the analysis uses it. */
export interface AnalysisPoint {
  temperatureK: number;
  resistivityOhmCm: number;
}

/** The readings of a sweep usable for analysis, sorted by temperature. */
export interface SweepReadings {
  points: AnalysisPoint[];
  /** Readings left out: resistivity not finite or not positive. */
  skipped: number;
}

/**
 * The sweep when the user may see its wafer. A missing sweep, a deleted one and one on a wafer
 * hidden from a technician all answer 404.
 */
export async function visibleSweep(user: SessionUser, sweepId: number): Promise<VisibleSweep> {
  const sweep = await Sweep.findByPk(sweepId);
  if (!sweep) throw notFound(`Sweep ${sweepId}`);
  try {
    const { wafer, lot } = await visibleWafer(user, sweep.waferId);
    return { sweep, wafer, lot };
  } catch (error) {
    throw asNotFound(error, `Sweep ${sweepId}`);
  }
}

/**
 * Reads a sweep's points (temperature and resistivity only), sorted by temperature; with a
 * window, only the points with minK <= T <= maxK (inclusive).
 */
export async function sweepReadings(
  sweepId: number,
  window?: { minK: number; maxK: number },
): Promise<SweepReadings> {
  const where: Record<string | symbol, unknown> = { sweepId };
  if (window) where['temperatureK'] = { [Op.between]: [window.minK, window.maxK] };
  const rows = (await SweepPoint.findAll({
    attributes: ['temperatureK', 'resistivityOhmCm'],
    where,
    raw: true,
  })) as unknown as AnalysisPoint[];
  const points: AnalysisPoint[] = [];
  let skipped = 0;
  for (const r of rows) {
    const t = Number(r.temperatureK);
    const rho = Number(r.resistivityOhmCm);
    if (Number.isFinite(t) && t > 0 && Number.isFinite(rho) && rho > 0) {
      points.push({ temperatureK: t, resistivityOhmCm: rho });
    } else {
      skipped += 1;
    }
  }
  points.sort((a, b) => a.temperatureK - b.temperatureK);
  return { points, skipped };
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

/** Points with minK <= T <= maxK (inclusive, as the physics library's windows are). */
export function pointsInWindow(
  points: readonly AnalysisPoint[],
  minK: number,
  maxK: number,
): AnalysisPoint[] {
  return points.filter((p) => p.temperatureK >= minK && p.temperatureK <= maxK);
}

/** The summary block the analysis answers carry. */
export function sweepSummary(v: VisibleSweep, skipped: number): AnalysisSweepDto {
  return {
    id: v.sweep.id,
    waferId: v.wafer.id,
    waferNumber: v.wafer.number,
    lotId: v.lot.id,
    lotCode: v.lot.code,
    material: v.lot.material,
    method: v.sweep.method,
    stationId: v.sweep.stationId,
    pointCount: v.sweep.pointCount,
    skippedPointCount: skipped,
    minTemperatureK: v.sweep.minTemperatureK,
    maxTemperatureK: v.sweep.maxTemperatureK,
    originalName: v.sweep.originalName,
    createdAt: v.sweep.createdAt.toISOString(),
  };
}
