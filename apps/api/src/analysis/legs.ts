/**
 * A sweep's ramp legs as the analysis reads them: their direction, range and steps, which leg a
 * fit uses by default, and the thermal lag an up and a down leg show.
 */
import type { FlaggedReadingDto, LegDto, PointFinding } from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS, thermalLag } from '@rhotrace/physics';
import { validationFailed } from '../errors';
import { LEG_CHANGE_FACTOR, stepRanges } from '../sweeps/import/faults/legs';
import type { LegReading } from './sweep-data.service';

/** A default leg needs at least this many dwell steps. */
export const MIN_LEG_STEPS = 5;
/** An up and a down leg must share this much temperature for a thermal lag, K. */
export const MIN_LAG_OVERLAP_K = 20;

/** The readings of each leg in recorded order (leg 0, before legs existed, reads as leg 1). */
function byLeg(readings: readonly LegReading[]): Map<number, LegReading[]> {
  const legs = new Map<number, LegReading[]>();
  for (const r of readings) {
    const k = r.leg || 1;
    const list = legs.get(k) ?? [];
    list.push(r);
    legs.set(k, list);
  }
  for (const list of legs.values()) list.sort((a, b) => a.sequence - b.sequence);
  return new Map([...legs.entries()].sort((a, b) => a[0] - b[0]));
}

/** Legs described before, by the shared readings list of a cached sweep (see legReadings). */
const described = new WeakMap<readonly LegReading[], LegDto[]>();

/**
 * Each leg's direction, range and dwell steps; described once per cached sweep, as the
 * readings list it is given is shared while the sweep is cached (do not change the answer).
 */
export function describeLegs(readings: readonly LegReading[]): LegDto[] {
  let legs = described.get(readings);
  if (!legs) {
    legs = describeLegsOnce(readings);
    described.set(readings, legs);
  }
  return legs;
}

function describeLegsOnce(readings: readonly LegReading[]): LegDto[] {
  const tol = PHYSICS_DEFAULTS.fitStepToleranceK;
  return [...byLeg(readings).entries()].map(([index, list]) => {
    const t = list.map((r) => r.temperatureK);
    // A loop, not Math.min(...t): a 100,000-reading leg would pass 100,000 arguments.
    let minK = Infinity;
    let maxK = -Infinity;
    for (const v of t) {
      if (v < minK) minK = v;
      if (v > maxK) maxK = v;
    }
    const move = t[t.length - 1]! - t[0]!;
    const direction = maxK - minK <= LEG_CHANGE_FACTOR * tol ? 'hold' : move > 0 ? 'up' : 'down';
    return { index, direction, minK, maxK, stepCount: stepRanges(t, 0, t.length, tol).length };
  });
}

/**
 * The leg a request means: a number (400 when the sweep has no such leg), `all` (null), or by
 * default the first leg with `MIN_LEG_STEPS` steps (null, all legs, when none has).
 */
export function chooseLeg(legs: LegDto[], requested: number | 'all' | undefined): number | null {
  if (requested === 'all' || legs.length <= 1) {
    if (typeof requested === 'number' && requested !== 1) throw noLeg(requested, legs);
    return null;
  }
  if (typeof requested === 'number') {
    if (!legs.some((l) => l.index === requested)) throw noLeg(requested, legs);
    return requested;
  }
  return legs.find((l) => l.stepCount >= MIN_LEG_STEPS)?.index ?? null;
}

function noLeg(requested: number, legs: LegDto[]): Error {
  return validationFailed('The sweep has no such leg', [
    {
      field: 'leg',
      problem: `must be one of ${legs.map((l) => l.index).join(', ')} or all, got ${requested}`,
    },
  ]);
}

/**
 * The thermal lag from the first up and down legs that overlap by `MIN_LAG_OVERLAP_K` or more
 * (readings a fit leaves out are left out here too); null without such a pair or a result.
 */
export function legThermalLag(
  readings: readonly LegReading[],
  legs: LegDto[],
): { lagK: number; standardErrorK: number } | null {
  const up = legs.find((l) => l.direction === 'up');
  const down = legs.find((l) => l.direction === 'down');
  if (!up || !down) return null;
  const overlap = Math.min(up.maxK, down.maxK) - Math.max(up.minK, down.minK);
  if (overlap < MIN_LAG_OVERLAP_K) return null;
  const grouped = byLeg(readings.filter((r) => !r.excludable));
  const curve = (index: number) => {
    const list = grouped.get(index) ?? [];
    return {
      temperaturesK: list.map((r) => r.temperatureK),
      lnRho: list.map((r) => Math.log(r.resistivityOhmCm)),
    };
  };
  const a = curve(up.index);
  const b = curve(down.index);
  if (a.temperaturesK.length < 3 || b.temperaturesK.length < 3) return null;
  const lag = thermalLag(a, b);
  return lag ? { lagK: lag.lagK, standardErrorK: lag.standardErrorK } : null;
}

/**
 * Where the flagged readings lie, for the plots: those with a finding, in the leg studied (every
 * leg when `leg` is null), in recorded order.
 */
export function flaggedReadings(
  readings: readonly LegReading[],
  findings: PointFinding[],
  leg: number | null,
): FlaggedReadingDto[] {
  const flagged = new Set(findings.map((f) => f.sequence));
  return readings
    .filter((r) => flagged.has(r.sequence) && (leg === null || (r.leg || 1) === leg))
    .sort((a, b) => a.sequence - b.sequence)
    .map((r) => ({
      sequence: r.sequence,
      temperatureK: r.temperatureK,
      resistivityOhmCm: r.resistivityOhmCm,
    }));
}
