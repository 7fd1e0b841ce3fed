/**
 * Probe current for a planned sweep: large enough for a voltage the meter reads well, small
 * enough not to heat the sample or leave the meter's range.
 */
import { PhysicsInputError } from '../errors';
import {
  circularSliceFactor,
  finiteThicknessFactor,
  MIN_DIAMETER_SPACINGS,
} from '../probe/four-point';
import { THIN_SHEET_FACTOR } from '../probe/four-point';
import { requireObject, requireOneOf, requirePositive } from '../validate';

/** Probe arrangements the planner knows. */
export type PlanMethod = 'four-point' | 'van-der-pauw';
const METHODS: readonly PlanMethod[] = ['four-point', 'van-der-pauw'];

/** What set the planned current. */
export type CurrentLimit =
  'target-voltage' | 'max-voltage' | 'max-power' | 'min-current' | 'max-current';

/** Result of `planProbeCurrent`. */
export interface ProbeCurrentPlan {
  currentA: number;
  /** Expected voltage across the sensing probes, V. */
  voltageV: number;
  /** Power dissipated in the sample, V I, W. */
  powerW: number;
  limitedBy: CurrentLimit;
}

/** Probe geometry and limits shared by `planProbeCurrent` and `planCurrentRanges`. */
export interface ProbeLimits {
  method: PlanMethod;
  targetVoltageV: number;
  maxVoltageV: number;
  maxPowerW: number;
  minCurrentA?: number;
  maxCurrentA?: number;
  /** Four-point probe spacing, cm (with thicknessCm: the finite-thickness correction). */
  spacingCm?: number;
  thicknessCm?: number;
  /** Four-point: slice diameter, cm (at least 3 spacings; the finite-diameter correction). */
  diameterCm?: number;
}

interface CheckedLimits {
  method: PlanMethod;
  targetVoltageV: number;
  maxVoltageV: number;
  maxPowerW: number;
  minCurrentA: number;
  maxCurrentA: number;
  /** V/I per ohm of sheet resistance. */
  transferPerOhmSq: number;
}

function checkLimits(fn: string, o: Record<string, unknown>): CheckedLimits {
  const method = requireOneOf(fn, 'method', o['method'], METHODS);
  const optional = (name: string, fallback: number) =>
    o[name] === undefined ? fallback : requirePositive(fn, name, o[name]);
  const minCurrentA = optional('minCurrentA', 0);
  const maxCurrentA = optional('maxCurrentA', Infinity);
  if (minCurrentA > maxCurrentA) {
    throw new PhysicsInputError(fn, 'minCurrentA', 'requires minCurrentA at most maxCurrentA');
  }
  let transferPerOhmSq = Math.LN2 / Math.PI;
  if (method === 'four-point') {
    // V/I = R_s / ((pi / ln 2) C_d F_t): the inverse of `fourPointProbe` with both corrections.
    let factor = THIN_SHEET_FACTOR;
    const s =
      o['spacingCm'] === undefined ? undefined : requirePositive(fn, 'spacingCm', o['spacingCm']);
    if (s !== undefined && o['thicknessCm'] !== undefined) {
      factor *= finiteThicknessFactor(requirePositive(fn, 'thicknessCm', o['thicknessCm']) / s);
    }
    if (s !== undefined && o['diameterCm'] !== undefined) {
      const d = requirePositive(fn, 'diameterCm', o['diameterCm']);
      if (d < MIN_DIAMETER_SPACINGS * s * (1 - 1e-12)) {
        throw new PhysicsInputError(
          fn,
          'diameterCm',
          `requires diameterCm of at least 3 probe spacings (${3 * s} cm), got ${d}`,
        );
      }
      factor = (factor * circularSliceFactor(d / s)) / THIN_SHEET_FACTOR;
    }
    transferPerOhmSq = 1 / factor;
  }
  return {
    method,
    targetVoltageV: requirePositive(fn, 'targetVoltageV', o['targetVoltageV']),
    maxVoltageV: requirePositive(fn, 'maxVoltageV', o['maxVoltageV']),
    maxPowerW: requirePositive(fn, 'maxPowerW', o['maxPowerW']),
    minCurrentA,
    maxCurrentA,
    transferPerOhmSq,
  };
}

/** The current for one transfer resistance (V/I, ohm) under checked limits. */
function currentFor(r: number, l: CheckedLimits): ProbeCurrentPlan {
  const ceilings: Array<[number, CurrentLimit]> = [
    [l.targetVoltageV / r, 'target-voltage'],
    [l.maxVoltageV / r, 'max-voltage'],
    [Math.sqrt(l.maxPowerW / r), 'max-power'],
    [l.maxCurrentA, 'max-current'],
  ];
  // The lowest ceiling wins; on a tie the earlier entry (the target) names it.
  let [currentA, limitedBy] = ceilings[0]!;
  for (const [value, name] of ceilings) if (value < currentA) [currentA, limitedBy] = [value, name];
  if (currentA < l.minCurrentA) [currentA, limitedBy] = [l.minCurrentA, 'min-current'];
  const voltageV = currentA * r;
  return { currentA, voltageV, powerW: voltageV * currentA, limitedBy };
}

/**
 * The probe current for a sample of known sheet resistance: the current that gives the target
 * voltage, lowered to keep the voltage under the meter's maximum, the power under `maxPowerW`
 * and the current under `maxCurrentA`, and raised to `minCurrentA` when the source cannot go
 * lower (then voltage or power may exceed their limits: the caller checks).
 *
 * Formula: with the transfer resistance r = V/I,
 *   four-point: r = R_s / ((pi / ln 2) C(d/s)/(pi / ln 2) F(t/s))  (thin large slice:
 *     r = R_s / 4.532; corrections as in `fourPointProbe`, applied when spacing and thickness or
 *     diameter are given),
 *   van der Pauw (symmetric sample): r = R_s ln 2 / pi,
 *   I = max(minCurrentA, min(targetVoltageV / r, maxVoltageV / r, sqrt(maxPowerW / r),
 *     maxCurrentA)), V = I r, P = V I (power dissipated in the sample).
 * Sources: Valdes 1954, Proc. IRE 42, 420; Smits 1958, Bell Syst. Tech. J. 37, 711;
 * van der Pauw 1958, Philips Res. Rep. 13, 1.
 *
 * @param input method, sheetResistanceOhmSq (ohm/sq, the sample's true rho / t), voltages (V),
 *   maxPowerW (W), optional current limits (A) and geometry (cm)
 * @example planProbeCurrent({ method: 'four-point', sheetResistanceOhmSq: 100,
 *   targetVoltageV: 0.01, maxVoltageV: 0.1, maxPowerW: 0.01 })
 *   // { currentA: 4.532e-4, voltageV: 0.01, powerW: 4.532e-6, limitedBy: 'target-voltage' }
 */
export function planProbeCurrent(
  input: ProbeLimits & { sheetResistanceOhmSq: number },
): ProbeCurrentPlan {
  const fn = 'planProbeCurrent';
  const o = requireObject(fn, 'input', input);
  const limits = checkLimits(fn, o);
  const rs = requirePositive(fn, 'sheetResistanceOhmSq', o['sheetResistanceOhmSq']);
  return currentFor(rs * limits.transferPerOhmSq, limits);
}

/** One current held over consecutive steps of `planCurrentRanges`. */
export interface CurrentRange {
  /** Index of the first and last step served (inclusive). */
  fromIndex: number;
  toIndex: number;
  currentA: number;
  /** The limit that set this range's current (at its most restrictive step). */
  limitedBy: CurrentLimit;
}

/**
 * As few probe currents as serve a list of steps: one current held over consecutive steps as
 * long as every step of the range keeps its voltage at or above `maxVoltageV / 1000` (the
 * meter's readable floor, three decades below its maximum); a new range starts where it would
 * not (real sources switch ranges). A range's current is the smallest of its steps'
 * `planProbeCurrent` currents, so no step exceeds its target voltage, the power limit or the
 * maximum current. Greedy from the first step; since adding a step only lowers the range's
 * current and its lowest resistance, greedy gives the fewest ranges.
 * Source: common practice, no source.
 *
 * @param sheetResistancesOhmSq the expected sheet resistance at each step, in step order
 * @param limits geometry and limits as for `planProbeCurrent`
 * @returns the ranges, and for each step its current, voltage, power and limit
 * @example planCurrentRanges([100, 150], { method: 'van-der-pauw', targetVoltageV: 0.01,
 *   maxVoltageV: 0.1, maxPowerW: 0.01 }).ranges.length // 1
 */
export function planCurrentRanges(
  sheetResistancesOhmSq: readonly number[],
  limits: ProbeLimits,
): { ranges: CurrentRange[]; steps: ProbeCurrentPlan[] } {
  const fn = 'planCurrentRanges';
  const l = checkLimits(fn, requireObject(fn, 'limits', limits));
  if (!Array.isArray(sheetResistancesOhmSq) || sheetResistancesOhmSq.length === 0) {
    throw new PhysicsInputError(
      fn,
      'sheetResistancesOhmSq',
      'requires at least one sheet resistance',
    );
  }
  const r = sheetResistancesOhmSq.map(
    (rs) => requirePositive(fn, 'sheetResistancesOhmSq', rs) * l.transferPerOhmSq,
  );
  const own = r.map((ri) => currentFor(ri, l));
  const floorV = l.maxVoltageV / 1000;
  const ranges: CurrentRange[] = [];
  let start = 0;
  while (start < r.length) {
    let best = own[start]!;
    let minR = r[start]!;
    let end = start;
    while (end + 1 < r.length) {
      const next = own[end + 1]!;
      const lower = next.currentA < best.currentA ? next : best;
      if (lower.currentA * Math.min(minR, r[end + 1]!) < floorV) break;
      best = lower;
      minR = Math.min(minR, r[end + 1]!);
      end += 1;
    }
    ranges.push({
      fromIndex: start,
      toIndex: end,
      currentA: best.currentA,
      limitedBy: best.limitedBy,
    });
    start = end + 1;
  }
  const steps = ranges.flatMap((range) =>
    r.slice(range.fromIndex, range.toIndex + 1).map((ri) => {
      const voltageV = range.currentA * ri;
      return {
        currentA: range.currentA,
        voltageV,
        powerW: voltageV * range.currentA,
        limitedBy: range.limitedBy,
      };
    }),
  );
  return { ranges, steps };
}
