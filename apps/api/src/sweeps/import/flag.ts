/**
 * Stage 6, flag: marks doubtful points without refusing them, with the reason for each, and
 * splits the sweep into ramp legs. A jump needs only the previous point and is flagged as the
 * point is added; everything else needs the whole sweep (the legs first, then within each leg a
 * temperature against it, Hampel outliers, self-heating and unsettled steps), so `finish` names
 * those and the store marks them. Polarity asymmetry comes flagged from the point stage.
 */
import { JUMP_FACTOR, type PointFinding, type PointFlag } from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';
import { hampelOutliers } from './faults/hampel';
import { LegSplitter, stepRanges, type LegRange } from './faults/legs';
import { readingScatter } from './faults/noise';
import { selfHeating, stepLevels, unsettledSteps, type Finding } from './faults/step-faults';
import { listRows, type ConvertedPoint } from './import-types';

/** A step against the ramp direction larger than this is a reversal (thermometer noise is less). */
export const REVERSAL_TOLERANCE_K = 0.5;

/** R_A/R_B (or R_B/R_A) above this makes the van der Pauw solution sensitive: a warning. */
export const VAN_DER_PAUW_RATIO_WARNING = 3;

/** Flags `finish` adds to stored points, by position (0-based, in stored order). */
export type LateFlags = Partial<Record<PointFlag, number[]>>;

/** What the flag stage found over the whole sweep. */
export interface FlagSummary {
  /** The ramp legs, numbered from 1 in this order. */
  legs: LegRange[];
  /** Flags to add to stored points (not those already on the points). */
  late: LateFlags;
  /** Positions (0-based, in stored order) of the points that go against their leg. */
  reversals: number[];
  /** Points carrying a doubtful flag. */
  flagged: number;
  /** Each doubtful point and why, in stored order. */
  findings: PointFinding[];
  warnings: string[];
  minTemperatureK: number | null;
  maxTemperatureK: number | null;
}

const WARNING_TEXT: Partial<Record<PointFlag, string>> = {
  outlier: 'lie outside a Hampel filter on ln rho within their leg (window 7, 4 scaled MAD)',
  'polarity-asymmetry': 'have forward and reverse readings more than 2 % apart',
  'self-heating': 'read high at the higher current level (self-heating)',
  unsettled: 'belong to a step still drifting one way (dwell too short)',
  'contact-fault':
    'have reciprocal van der Pauw readings more than 2 % apart (a non-ohmic or misplaced contact)',
};

/** Finds doubtful points as they come and over the whole sweep at the end. */
export class SuspiciousPointFinder {
  private previous: ConvertedPoint | null = null;
  private readonly temperatures: number[] = [];
  private readonly lnRho: number[] = [];
  private readonly currents: number[] = [];
  private readonly rows: number[] = [];
  private readonly early: Finding[] = [];
  private readonly jumps: number[] = [];
  private worstRatio = 0;
  private sensitiveRatios = 0;
  private readonly legs: LegSplitter;

  constructor(private readonly stepToleranceK: number = PHYSICS_DEFAULTS.fitStepToleranceK) {
    this.legs = new LegSplitter(stepToleranceK);
  }

  /** Takes the next points, adding their `jump` flags in place; returns them. */
  addAll(points: ConvertedPoint[]): ConvertedPoint[] {
    for (const point of points) this.add(point);
    return points;
  }

  /** Takes the next point, adding its `jump` flag in place. */
  add(point: ConvertedPoint): void {
    const index = this.rows.length;
    const prev = this.previous;
    if (prev) {
      const ratio = point.resistivityOhmCm / prev.resistivityOhmCm;
      if (ratio > JUMP_FACTOR || ratio < 1 / JUMP_FACTOR) {
        point.flags.push('jump');
        this.jumps.push(index);
        const times = ratio > 1 ? ratio : 1 / ratio;
        this.early.push({
          index,
          flag: 'jump',
          reason: `resistivity ${ratio > 1 ? 'rises' : 'falls'} ${times.toPrecision(3)} times from the previous point`,
        });
      }
    }
    for (const [flag, reason] of Object.entries(point.reasons ?? {})) {
      this.early.push({ index, flag: flag as PointFlag, reason });
    }
    const r = point.resistanceRatio;
    if (r !== undefined) {
      const worst = Math.max(r, 1 / r);
      if (worst > VAN_DER_PAUW_RATIO_WARNING) this.sensitiveRatios++;
      this.worstRatio = Math.max(this.worstRatio, worst);
    }
    this.previous = point;
    this.temperatures.push(point.temperatureK);
    this.legs.add(point.temperatureK);
    this.lnRho.push(Math.log(point.resistivityOhmCm));
    this.currents.push(point.currentA ?? Number.NaN);
    this.rows.push(point.sourceRows[0]!);
  }

  /**
   * Writes the leg on the points from position `from` on whose leg can no longer change (their
   * late flags may still come); returns how many leading points have their leg.
   */
  markSettledLegs(points: ConvertedPoint[], from: number): number {
    const settled = this.legs.settled;
    for (let i = from; i < settled; i++) points[i]!.leg = this.legs.legOf(i);
    return Math.max(from, settled);
  }

  /** After the last point: legs, the flags to add, the findings and warnings, the range. */
  finish(): FlagSummary {
    const t = this.temperatures;
    const legs = this.legs.finish();
    const late: Finding[] = [];
    const stepsByLeg = legs.map((leg) => stepRanges(t, leg.start, leg.end, this.stepToleranceK));
    const levelsByLeg = legs.map((leg) => this.levelSeries(leg));
    const sigma = readingScatter(this.lnRho, levelsByLeg.flat());
    legs.forEach((leg, k) => {
      late.push(...this.reversalsIn(leg));
      const outliers = levelsByLeg[k]!.flatMap((at) =>
        hampelOutliers(t, this.lnRho, at, sigma ?? undefined),
      );
      for (const o of outliers) {
        const off = Math.exp(this.lnRho[o.index]! - o.median) - 1;
        const spreads = Math.abs(this.lnRho[o.index]! - o.median) / o.scaledMad;
        late.push({
          index: o.index,
          flag: 'outlier',
          reason: `ln rho lies ${spreads.toFixed(1)} scaled MAD off the trend of its neighbours (${off >= 0 ? '+' : ''}${(off * 100).toFixed(1)} %) in leg ${k + 1}`,
        });
      }
    });
    if (sigma !== null) {
      const data = { temperaturesK: t, lnRho: this.lnRho, currentsA: this.currents };
      for (const steps of stepsByLeg) {
        const levels = stepLevels(data, steps);
        // one by one: spreading a whole sweep's findings as arguments overflows the stack
        for (const f of selfHeating(data, steps, sigma, levels)) late.push(f);
        for (const f of unsettledSteps(data, steps, sigma, levels)) late.push(f);
      }
    }
    const lateFlags: LateFlags = {};
    for (const f of late) (lateFlags[f.flag] ??= []).push(f.index);
    for (const [flag, list] of Object.entries(lateFlags)) {
      lateFlags[flag as PointFlag] = Array.from(Int32Array.from(new Set(list)).sort());
    }
    const all = [...this.early, ...late].sort((a, b) => a.index - b.index);
    return {
      legs,
      late: lateFlags,
      reversals: lateFlags['temperature-reversal'] ?? [],
      flagged: distinctIndexes(all),
      findings: all.map((f) => ({
        sequence: f.index + 1,
        row: this.rows[f.index]!,
        flag: f.flag,
        reason: f.reason,
      })),
      warnings: this.warnings(all),
      ...this.range(),
    };
  }

  /** Steps against the leg's direction by more than `REVERSAL_TOLERANCE_K`. */
  private reversalsIn(leg: LegRange): Finding[] {
    if (leg.direction === 'hold') return [];
    const sign = leg.direction === 'up' ? 1 : -1;
    const t = this.temperatures;
    const found: Finding[] = [];
    for (let i = leg.start + 1; i < leg.end; i++) {
      const step = t[i]! - t[i - 1]!;
      if (step * sign < -REVERSAL_TOLERANCE_K) {
        found.push({
          index: i,
          flag: 'temperature-reversal',
          reason: `the temperature steps ${Math.abs(step).toFixed(2)} K ${sign > 0 ? 'down' : 'up'} inside a leg running ${leg.direction}`,
        });
      }
    }
    return found;
  }

  /** The leg's positions split by current level (two significant figures of |I|). */
  private levelSeries(leg: LegRange): number[][] {
    const byLevel = new Map<string, number[]>();
    // most files hold one current throughout: its key is worked out once, not per point
    let lastCurrent = Number.NaN;
    let key = 'none';
    for (let i = leg.start; i < leg.end; i++) {
      const c = this.currents[i]!;
      if (!Object.is(c, lastCurrent)) {
        key = Number.isFinite(c) ? Math.abs(c).toPrecision(2) : 'none';
        lastCurrent = c;
      }
      const list = byLevel.get(key) ?? [];
      list.push(i);
      byLevel.set(key, list);
    }
    return [...byLevel.values()];
  }

  private warnings(all: Finding[]): string[] {
    // one pass groups the rows by flag (a long sweep can hold a finding for every point)
    const byFlag = new Map<PointFlag, number[]>();
    for (const f of all) {
      const list = byFlag.get(f.flag);
      if (list) list.push(this.rows[f.index]!);
      else byFlag.set(f.flag, [this.rows[f.index]!]);
    }
    const rowsOf = (flag: PointFlag) => byFlag.get(flag) ?? [];
    const warnings: string[] = [];
    const jumps = rowsOf('jump');
    if (jumps.length) {
      warnings.push(
        `${jumps.length} point(s) differ from the previous one by more than ${JUMP_FACTOR} times in resistivity (rows ${listRows(jumps)})`,
      );
    }
    const reversals = rowsOf('temperature-reversal');
    if (reversals.length) {
      warnings.push(
        `the temperature goes against the ramp at ${reversals.length} point(s) (rows ${listRows(reversals)})`,
      );
    }
    for (const [flag, text] of Object.entries(WARNING_TEXT)) {
      const rows = [...new Set(rowsOf(flag as PointFlag))];
      if (rows.length) warnings.push(`${rows.length} point(s) ${text} (rows ${listRows(rows)})`);
    }
    if (this.sensitiveRatios) {
      warnings.push(
        `R_A/R_B reaches ${this.worstRatio.toFixed(2)} (above ${VAN_DER_PAUW_RATIO_WARNING}) at ${this.sensitiveRatios} point(s): the sample shape or contact placement makes the van der Pauw result sensitive; check the contacts`,
      );
    }
    return warnings;
  }

  private range(): { minTemperatureK: number | null; maxTemperatureK: number | null } {
    const t = this.temperatures;
    let minTemperatureK = t.length ? Infinity : null;
    let maxTemperatureK = t.length ? -Infinity : null;
    for (const k of t) {
      if (k < minTemperatureK!) minTemperatureK = k;
      if (k > maxTemperatureK!) maxTemperatureK = k;
    }
    return { minTemperatureK, maxTemperatureK };
  }
}

/** The number of different positions among findings sorted by position. */
function distinctIndexes(sorted: Finding[]): number {
  let count = 0;
  for (let k = 0; k < sorted.length; k++) {
    if (k === 0 || sorted[k]!.index !== sorted[k - 1]!.index) count++;
  }
  return count;
}

/**
 * Writes what `finish` found onto the points themselves: each point's leg (1, 2, ...) and the
 * late flags after the flags it already carries, flag by flag in the order of `summary.late`.
 * Points stored before (their legs settled early) get their new flags rewritten; those are the
 * few `latePositions` names, where rewriting every point cost more than inserting it.
 */
export function markPoints(points: ConvertedPoint[], summary: FlagSummary): void {
  for (const [k, leg] of summary.legs.entries()) {
    for (let i = leg.start; i < leg.end; i++) points[i]!.leg = k + 1;
  }
  for (const [flag, positions] of Object.entries(summary.late)) {
    for (const i of positions) points[i]!.flags.push(flag as PointFlag);
  }
}

/** Positions before `before` that `summary` adds a late flag to, ascending, each once. */
export function latePositions(summary: FlagSummary, before: number): number[] {
  const positions = new Set<number>();
  for (const list of Object.values(summary.late)) {
    for (const i of list) if (i < before) positions.add(i);
  }
  return Array.from(Int32Array.from(positions).sort());
}
