/**
 * Faults seen within a dwell step: self-heating (two current levels disagree) and a step still
 * drifting (the dwell was too short to settle).
 */
import type { PointFlag } from '@rhotrace/api-types';
import { currentLevels, meanAt } from './noise';

/** A difference beyond this many times its scatter is a fault (both checks). */
export const STEP_FAULT_SIGMAS = 3;
/** Readings a step (at one current) needs before it can be called unsettled. */
export const UNSETTLED_MIN_READINGS = 5;
/** Kendall's tau at or above which a step's readings run one way. */
export const UNSETTLED_MIN_TAU = 0.8;

/** A fault of one point, with the reason in words. */
export interface Finding {
  index: number;
  flag: PointFlag;
  reason: string;
}

/** What the checks read, each indexed by position in stored order. */
export interface StepSeries {
  temperaturesK: ArrayLike<number>;
  lnRho: ArrayLike<number>;
  /** Current of each point, A (NaN when unknown). */
  currentsA: ArrayLike<number>;
}

/** A step's readings split by current level, with the means of its low level. */
export interface StepLevels {
  low: number[];
  high: number[];
  /** Mean temperature and ln rho of the low level. */
  lowMeanK: number;
  lowMeanLnRho: number;
}

/**
 * Each step's current levels and low-level means, worked out once for both checks (each step's
 * slope reads its neighbours' means too).
 */
export function stepLevels(data: StepSeries, steps: Array<[number, number]>): StepLevels[] {
  return steps.map(([s, e]) => {
    const { low, high } = currentLevels(data.currentsA, s, e);
    return {
      low,
      high,
      lowMeanK: meanAt(data.temperaturesK, low),
      lowMeanLnRho: meanAt(data.lnRho, low),
    };
  });
}

const pct = (x: number) => `${x >= 0 ? '+' : ''}${(x * 100).toFixed(2)} %`;

/**
 * alpha = d ln rho / dT at step `k`, the least-squares slope over the low-current means of the
 * steps k-2 ... k+2 (within the leg); null with fewer than two steps.
 */
function localAlpha(levels: StepLevels[], k: number): number | null {
  const xs: number[] = [];
  const ys: number[] = [];
  for (let j = Math.max(0, k - 2); j <= Math.min(levels.length - 1, k + 2); j++) {
    xs.push(levels[j]!.lowMeanK);
    ys.push(levels[j]!.lowMeanLnRho);
  }
  if (xs.length < 2) return null;
  const mx = xs.reduce((a, b) => a + b, 0) / xs.length;
  const my = ys.reduce((a, b) => a + b, 0) / ys.length;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < xs.length; i++) {
    sxy += (xs[i]! - mx) * (ys[i]! - my);
    sxx += (xs[i]! - mx) ** 2;
  }
  return sxx > 0 ? sxy / sxx : null;
}

/**
 * Self-heating: at a step with two current levels, the higher current's mean resistivity differs
 * from the lower's by more than `STEP_FAULT_SIGMAS` times the scatter of that difference, in the
 * direction warming moves it. The implied temperature rise is dT = (rho(I2)/rho(I1) - 1) / alpha
 * with alpha = d ln rho / dT the sweep's local temperature coefficient. The higher-current
 * readings are flagged. Common practice, no source (the dT formula is the first-order expansion
 * rho(T + dT) = rho(T) (1 + alpha dT)).
 */
export function selfHeating(
  data: StepSeries,
  steps: Array<[number, number]>,
  sigma: number,
  levels: StepLevels[] = stepLevels(data, steps),
): Finding[] {
  const found: Finding[] = [];
  levels.forEach(({ low, high }, k) => {
    if (!high.length || !low.length) return;
    const diff = meanAt(data.lnRho, high) - meanAt(data.lnRho, low);
    const scatter = sigma * Math.sqrt(1 / high.length + 1 / low.length);
    if (!(Math.abs(diff) > STEP_FAULT_SIGMAS * scatter)) return;
    const alpha = localAlpha(levels, k);
    const ratio = Math.exp(diff) - 1;
    const dT = alpha ? ratio / alpha : null;
    // warming moves rho the way alpha says; the other way is not heating
    if (dT !== null && dT <= 0) return;
    const iLow = Math.abs(meanAt(data.currentsA, low));
    const iHigh = Math.abs(meanAt(data.currentsA, high));
    const t = levels[k]!.lowMeanK.toFixed(1);
    const rise =
      dT === null
        ? 'the temperature coefficient here is unknown, so the rise is not estimated'
        : `self-heating of about ${dT.toFixed(1)} K (alpha ${pct(alpha!)}/K)`;
    for (const index of high) {
      found.push({
        index,
        flag: 'self-heating',
        reason: `at ${t} K, ${fmtA(iHigh)} reads ${pct(ratio)} against ${fmtA(iLow)}: ${rise}`,
      });
    }
  });
  return found;
}

function fmtA(a: number): string {
  return a >= 1e-3 ? `${(a * 1e3).toPrecision(3)} mA` : `${(a * 1e6).toPrecision(3)} µA`;
}

/**
 * Unsettled: at one current level, a step of `UNSETTLED_MIN_READINGS` or more readings whose
 * ln rho runs one way (Kendall's tau >= `UNSETTLED_MIN_TAU`) by more than `STEP_FAULT_SIGMAS`
 * times the scatter of one reading over the step (least-squares drift), once the change the
 * readings' own temperatures explain is taken out (the local d ln rho / dT times each reading's
 * offset from the step's mean temperature). Every reading of that level in the step is flagged. Kendall's tau: M. G. Kendall, Biometrika 30, 81 (1938).
 */
export function unsettledSteps(
  data: StepSeries,
  steps: Array<[number, number]>,
  sigma: number,
  levels: StepLevels[] = stepLevels(data, steps),
): Finding[] {
  const found: Finding[] = [];
  levels.forEach(({ low, high }, k) => {
    // what the readings' own temperatures explain is no drift: on a sweep logged while the
    // temperature ramps, a step's readings rise with T by alpha dT and are all sound
    const alpha = medianSlope(levels, k);
    for (const group of [low, high]) {
      const n = group.length;
      if (n < UNSETTLED_MIN_READINGS) continue;
      const tMean = meanAt(data.temperaturesK, group);
      const y = group.map((i) => data.lnRho[i]! - alpha * (data.temperaturesK[i]! - tMean));
      let concordant = 0;
      for (let a = 0; a < n; a++)
        for (let b = a + 1; b < n; b++) concordant += Math.sign(y[b]! - y[a]!);
      const tau = concordant / ((n * (n - 1)) / 2);
      const mx = (n - 1) / 2;
      const my = y.reduce((p, q) => p + q, 0) / n;
      let sxy = 0;
      let sxx = 0;
      y.forEach((v, i) => {
        sxy += (i - mx) * (v - my);
        sxx += (i - mx) ** 2;
      });
      const drift = (sxy / sxx) * (n - 1);
      if (Math.abs(tau) < UNSETTLED_MIN_TAU || !(Math.abs(drift) > STEP_FAULT_SIGMAS * sigma)) {
        continue;
      }
      const t = tMean.toFixed(1);
      const reason = `the ${n} readings at ${t} K drift by ${pct(Math.exp(drift) - 1)} one way (a dwell too short to settle)`;
      for (const index of group) found.push({ index, flag: 'unsettled', reason });
    }
  });
  return found;
}

/** Steps each side of step k whose neighbour-to-neighbour slopes give its alpha. */
const SLOPE_STEPS_EACH_SIDE = 4;

/**
 * d ln rho / dT at step k as the median of the slopes between neighbouring steps' low-current
 * means, k-4 ... k+4 within the leg: a median, so one outlying step cannot lend the others a
 * drift; 0 where no two steps differ in temperature.
 */
function medianSlope(levels: StepLevels[], k: number): number {
  const slopes: number[] = [];
  let previous: [number, number] | null = null;
  const last = Math.min(levels.length - 1, k + SLOPE_STEPS_EACH_SIDE);
  for (let j = Math.max(0, k - SLOPE_STEPS_EACH_SIDE); j <= last; j++) {
    const here: [number, number] = [levels[j]!.lowMeanK, levels[j]!.lowMeanLnRho];
    if (previous && here[0] !== previous[0])
      slopes.push((here[1] - previous[1]) / (here[0] - previous[0]));
    previous = here;
  }
  if (!slopes.length) return 0;
  slopes.sort((a, b) => a - b);
  const mid = slopes.length >> 1;
  return slopes.length % 2 ? slopes[mid]! : (slopes[mid - 1]! + slopes[mid]!) / 2;
}
