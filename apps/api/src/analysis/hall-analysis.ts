/**
 * The Hall part of a sweep analysis: carrier density and Hall mobility by temperature step,
 * the carrier type, the values at 300 K and the freeze-out window for the n(T) fit.
 */
import type {
  HallAnalysis,
  HallAnalysisStep,
  HallAt300K,
  SuggestedWindow,
} from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';
import { mean, median, sampleStandardDeviation } from 'simple-statistics';
import type { SweepIdentity } from '../sweeps/sweep-cache';
import { STEP_TOLERANCE_K, sweepReadings, type AnalysisPoint } from './sweep-data.service';

/** A value at 300 K is interpolated between steps no farther than this from 300 K, K. */
export const HALL_300K_REACH_K = 15;
/** |d ln n / d ln T| below this marks the saturation plateau (common practice, no source). */
const PLATEAU_SLOPE = 0.5;
/** Fewer freeze-out steps than this earn a caution. */
const FEW_STEPS = 5;

/** Hall steps of temperature-sorted readings (those without Hall quantities are skipped). */
export function hallSteps(points: readonly AnalysisPoint[]): HallAnalysisStep[] {
  const hall = points.filter(
    (p) =>
      typeof p.quantities?.carrierDensityCm3 === 'number' &&
      typeof p.quantities.hallMobilityCm2PerVs === 'number' &&
      typeof p.quantities.hallCoefficientCm3PerC === 'number',
  );
  const steps: HallAnalysisStep[] = [];
  let start = 0;
  while (start < hall.length) {
    const first = hall[start]!.temperatureK;
    let end = start + 1;
    while (end < hall.length && hall[end]!.temperatureK - first < STEP_TOLERANCE_K) end += 1;
    const group = hall.slice(start, end).map((p) => p.quantities!);
    const densities = group.map((q) => q.carrierDensityCm3!);
    const mobilities = group.map((q) => q.hallMobilityCm2PerVs!);
    const rh = mean(group.map((q) => q.hallCoefficientCm3PerC!));
    steps.push({
      temperatureK: mean(hall.slice(start, end).map((p) => p.temperatureK)),
      carrierDensityCm3: mean(densities),
      carrierDensitySpreadCm3: densities.length > 1 ? sampleStandardDeviation(densities) : 0,
      hallMobilityCm2PerVs: mean(mobilities),
      hallCoefficientCm3PerC: rh,
      carrierType: rh < 0 ? 'n' : 'p',
      count: group.length,
      hallMobilitySpreadCm2PerVs: mobilities.length > 1 ? sampleStandardDeviation(mobilities) : 0,
    });
    start = end;
  }
  return steps;
}

type HallKey = 'carrierDensityCm3' | 'hallMobilityCm2PerVs';

/** The sample standard deviation of each step value, by the value's key. */
const SPREAD_OF = {
  carrierDensityCm3: 'carrierDensitySpreadCm3',
  hallMobilityCm2PerVs: 'hallMobilitySpreadCm2PerVs',
} as const;

/** The steps either side of `temperatureK` within reach, and the weight f of the upper one. */
function bracket(steps: readonly HallAnalysisStep[], temperatureK: number) {
  const i = steps.findIndex((s) => s.temperatureK >= temperatureK);
  if (i < 0) return null;
  const hi = steps[i]!;
  const lo = i > 0 ? steps[i - 1]! : hi;
  if (hi.temperatureK - temperatureK > HALL_300K_REACH_K) return null;
  if (temperatureK - lo.temperatureK > HALL_300K_REACH_K) return null;
  const same = hi === lo || hi.temperatureK === lo.temperatureK;
  const f = same ? 1 : (temperatureK - lo.temperatureK) / (hi.temperatureK - lo.temperatureK);
  return { lo, hi, f };
}

/** Log-linear interpolation of a step value at `temperatureK` within `HALL_300K_REACH_K`. */
export function hallValueAt(
  steps: readonly HallAnalysisStep[],
  key: HallKey,
  temperatureK: number,
): number | null {
  const b = bracket(steps, temperatureK);
  if (!b) return null;
  const { lo, hi, f } = b;
  if (f === 1) return hi[key];
  return Math.exp(Math.log(lo[key]) + f * (Math.log(hi[key]) - Math.log(lo[key])));
}

/**
 * Standard uncertainty of `hallValueAt`'s value from the scatter of the readings (type A): each
 * step mean has u = s / sqrt(count), and the law of propagation of uncertainty (JCGM 100:2008,
 * GUM, eq. 10) applied to ln y = (1 - f) ln y_lo + f ln y_hi, the two step means independent,
 * gives u(y) = y sqrt(((1 - f) u_lo / y_lo)^2 + (f u_hi / y_hi)^2). Null when there is no value,
 * or when a step it uses has one reading (no scatter to judge by). It leaves out the Hall factor
 * (an assumption the answer states) and the uncertainty of the thickness and the field.
 */
export function hallUncertaintyAt(
  steps: readonly HallAnalysisStep[],
  key: HallKey,
  temperatureK: number,
): number | null {
  const b = bracket(steps, temperatureK);
  const value = hallValueAt(steps, key, temperatureK);
  if (!b || value === null) return null;
  const relative = (step: HallAnalysisStep): number | null => {
    const spread = step[SPREAD_OF[key]];
    if (step.count < 2 || spread === undefined) return null;
    return spread / Math.sqrt(step.count) / step[key];
  };
  const lo = b.f === 1 ? 0 : relative(b.lo);
  const hi = relative(b.hi);
  if (lo === null || hi === null) return null;
  return value * Math.hypot((1 - b.f) * lo, b.f * hi);
}

/**
 * Freeze-out window: the saturation density n_sat is the median of the steps where
 * |d ln n / d ln T| < 0.5 (the plateau); the window runs from the coldest step up to the last
 * step below `PHYSICS_DEFAULTS.freezeOutWindowIonizedFraction` (0.5) of n_sat, where the
 * density is set by ionization (n ~ exp(-E_d / 2kT) or exp(-E_d / kT)) and the level shows.
 */
export function freezeOutWindow(
  steps: readonly HallAnalysisStep[],
  points: readonly AnalysisPoint[],
): SuggestedWindow | null {
  if (steps.length < 3) return null;
  const plateau: number[] = [];
  for (let i = 1; i + 1 < steps.length; i++) {
    const a = steps[i - 1]!;
    const b = steps[i + 1]!;
    const slope =
      Math.log(b.carrierDensityCm3 / a.carrierDensityCm3) /
      Math.log(b.temperatureK / a.temperatureK);
    if (Math.abs(slope) < PLATEAU_SLOPE) plateau.push(steps[i]!.carrierDensityCm3);
  }
  if (plateau.length === 0) return null;
  const limit = PHYSICS_DEFAULTS.freezeOutWindowIonizedFraction * median(plateau);
  let last = -1;
  while (last + 1 < steps.length && steps[last + 1]!.carrierDensityCm3 < limit) last += 1;
  if (last < 2) return null;
  const minK = steps[0]!.temperatureK;
  const maxK = steps[last]!.temperatureK;
  const window: SuggestedWindow = {
    regime: 'freeze-out',
    minK,
    maxK,
    pointCount: points.filter((p) => p.temperatureK >= minK && p.temperatureK <= maxK).length,
  };
  if (last + 1 < FEW_STEPS) {
    window.warnings = [`Only ${last + 1} steps are frozen out: the level is loosely determined.`];
  }
  return window;
}

/** The Hall analysis of a sweep's readings, or null when none carries Hall quantities. */
export function hallAnalysis(
  points: readonly AnalysisPoint[],
  hallFactor: number,
): HallAnalysis | null {
  const steps = hallSteps(points);
  if (steps.length === 0) return null;
  const types = new Set(steps.map((s) => s.carrierType));
  return {
    steps,
    carrierType: types.size > 1 ? 'mixed' : steps[0]!.carrierType,
    hallFactor,
    carrierDensityAt300KCm3: hallValueAt(steps, 'carrierDensityCm3', 300),
    hallMobilityAt300KCm2PerVs: hallValueAt(steps, 'hallMobilityCm2PerVs', 300),
    freezeOutWindow: freezeOutWindow(steps, points),
    carrierDensityAt300KUncertaintyCm3: hallUncertaintyAt(steps, 'carrierDensityCm3', 300),
    hallMobilityAt300KUncertaintyCm2PerVs: hallUncertaintyAt(steps, 'hallMobilityCm2PerVs', 300),
  };
}

/** The Hall factor a sweep's parse report records, or null for a sweep that is not Hall. */
export function hallFactorOf(parseReport: unknown): number | null {
  const hall = (parseReport as { hall?: { hallFactor?: unknown } } | null)?.hall;
  return typeof hall?.hallFactor === 'number' ? hall.hallFactor : null;
}

/** A Hall sweep at 300 K for the compare and lot summaries; null for other sweeps. */
export async function hallAt300K(
  sweep: SweepIdentity & { parseReport: unknown },
): Promise<HallAt300K | null> {
  const factor = hallFactorOf(sweep.parseReport);
  if (factor === null) return null;
  const h = hallAnalysis((await sweepReadings(sweep)).points, factor);
  if (!h) return null;
  return {
    sweepId: sweep.id,
    carrierType: h.carrierType,
    carrierDensityAt300KCm3: h.carrierDensityAt300KCm3,
    hallMobilityAt300KCm2PerVs: h.hallMobilityAt300KCm2PerVs,
    hallFactor: factor,
    carrierDensityAt300KUncertaintyCm3: h.carrierDensityAt300KUncertaintyCm3 ?? null,
    hallMobilityAt300KUncertaintyCm2PerVs: h.hallMobilityAt300KUncertaintyCm2PerVs ?? null,
  };
}
