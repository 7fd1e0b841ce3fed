import type { AnalysisStep, RegimeName, SuggestedWindow } from '@rhotrace/api-types';
import { fitArrhenius } from '@rhotrace/physics';
import { pointsInWindow, type AnalysisPoint } from './sweep-data.service';
import { modelWindowLimits, type WindowSample } from './window-limits';

/** Steps either side of a step in its local Arrhenius fit. */
export const LOCAL_HALF_WIDTH = 3;
/**
 * Local activation energy above which a step counts as thermally activated (freeze-out or
 * intrinsic), eV. Extrinsic silicon shows a slightly negative one (mobility falls with T).
 */
export const ACTIVATED_THRESHOLD_EV = 0.01;
/** With no extrinsic stretch, an activated stretch above this local energy reads as intrinsic, eV. */
export const INTRINSIC_THRESHOLD_EV = 0.2;
/** Fewest steps a suggested window spans. */
export const MIN_WINDOW_STEPS = 3;
/** A suggested window with fewer steps than this carries a warning. */
export const ADVISED_WINDOW_STEPS = 5;
/** Longer step lists are thinned to about this many before the local slopes are taken. */
export const MAX_SLOPE_STEPS = 300;

interface Run {
  activated: boolean;
  from: number;
  to: number;
}

/**
 * Local slope of ln(rho) against 1/T at each step, as an activation energy in eV: the physics
 * library's Arrhenius fit over the step and `LOCAL_HALF_WIDTH` neighbours either side.
 */
export function localActivationEnergies(steps: readonly AnalysisStep[]): number[] {
  return steps.map((_, i) => {
    const from = Math.max(0, i - LOCAL_HALF_WIDTH);
    const to = Math.min(steps.length, i + LOCAL_HALF_WIDTH + 1);
    const window = steps
      .slice(from, to)
      .map((s) => ({ temperatureK: s.temperatureK, value: s.resistivityOhmCm }));
    // The steps are already averaged: each is its own step here.
    return fitArrhenius(window, { quantity: 'resistivity', stepToleranceK: 0 }).parameters
      .activationEnergyEv;
  });
}

function runsOf(energies: readonly number[]): Run[] {
  const runs: Run[] = [];
  energies.forEach((e, i) => {
    const activated = e > ACTIVATED_THRESHOLD_EV;
    const last = runs[runs.length - 1];
    if (last && last.activated === activated) last.to = i;
    else runs.push({ activated, from: i, to: i });
  });
  return runs;
}

const lengthOf = (r: Run) => r.to - r.from + 1;
const longest = (runs: Run[]) =>
  runs.filter((r) => lengthOf(r) >= MIN_WINDOW_STEPS).sort((a, b) => lengthOf(b) - lengthOf(a))[0];

/**
 * Freeze-out, extrinsic and intrinsic ranges the data suggest, from the local slope
 * d ln(rho) / d(1/T): the longest stretch of non-activated steps is the extrinsic range; the
 * longest activated stretch below it is freeze-out, the longest above it intrinsic (steps thinned
 * to about `MAX_SLOPE_STEPS` first, which also steadies the slope against noise).
 * With the lot's material and dopant type (`sample`), the activated windows are then kept clear
 * of the transitions (`modelWindowLimits`): the intrinsic window starts where n_i is at least 3
 * times the net doping and the freeze-out window ends where half of it is ionized, the net
 * doping read from the extrinsic window through the model. A window left with fewer than
 * `ADVISED_WINDOW_STEPS` steps says so in `warnings`. A heuristic starting point for the user's
 * own window, never a result in itself.
 */
export function suggestWindows(
  allSteps: readonly AnalysisStep[],
  points: readonly AnalysisPoint[],
  sample?: WindowSample,
): SuggestedWindow[] {
  let steps = allSteps;
  if (allSteps.length > MAX_SLOPE_STEPS) {
    const stride = Math.ceil(allSteps.length / MAX_SLOPE_STEPS);
    steps = allSteps.filter((_, i) => i % stride === 0 || i === allSteps.length - 1);
  }
  if (steps.length < 2 * LOCAL_HALF_WIDTH + 1) return [];
  const found = regimeRuns(steps);
  const extrinsic = found.find((f) => f.regime === 'extrinsic');
  // The model check costs a few hundred neutrality solves: only when there is a window to clip.
  const activated = found.some((f) => f.regime !== 'extrinsic');
  const limits =
    sample && activated
      ? modelWindowLimits(
          sample,
          extrinsic ? steps.slice(extrinsic.run.from, extrinsic.run.to + 1) : [],
        )
      : null;
  const windows: SuggestedWindow[] = [];
  for (const { regime, run } of found) {
    const warnings: string[] = [];
    let { from, to } = run;
    if (regime !== 'extrinsic' && limits) {
      if ('reason' in limits) warnings.push(limits.reason);
      else if (regime === 'intrinsic') {
        const start = limits.intrinsicStartK ?? Number.POSITIVE_INFINITY;
        while (from <= to && steps[from]!.temperatureK < start) from += 1;
      } else {
        const end = limits.freezeOutEndK ?? Number.NEGATIVE_INFINITY;
        while (to >= from && steps[to]!.temperatureK > end) to -= 1;
      }
    }
    if (to - from + 1 < MIN_WINDOW_STEPS) continue;
    const minK = steps[from]!.temperatureK;
    const maxK = steps[to]!.temperatureK;
    const stepCount = allSteps.filter(
      (s) => s.temperatureK >= minK && s.temperatureK <= maxK,
    ).length;
    if (stepCount < ADVISED_WINDOW_STEPS) {
      warnings.push(
        `Only ${stepCount} temperature steps: a slope from fewer than ${ADVISED_WINDOW_STEPS} ` +
          'steps is poorly determined.',
      );
    }
    const pointCount = pointsInWindow(points, minK, maxK).length;
    windows.push({ regime, minK, maxK, pointCount, ...(warnings.length ? { warnings } : {}) });
  }
  return windows.sort((a, b) => a.minK - b.minK);
}

/** The regime stretches of the local slopes (see `suggestWindows`). */
function regimeRuns(steps: readonly AnalysisStep[]): Array<{ regime: RegimeName; run: Run }> {
  const energies = localActivationEnergies(steps);
  const runs = runsOf(energies);
  const found: Array<{ regime: RegimeName; run: Run }> = [];
  const extrinsic = longest(runs.filter((r) => !r.activated));
  if (extrinsic) {
    found.push({ regime: 'extrinsic', run: extrinsic });
    const cold = longest(runs.filter((r) => r.activated && r.to < extrinsic.from));
    const hot = longest(runs.filter((r) => r.activated && r.from > extrinsic.to));
    if (cold) found.push({ regime: 'freeze-out', run: cold });
    if (hot) found.push({ regime: 'intrinsic', run: hot });
  } else {
    const run = longest(runs.filter((r) => r.activated));
    if (run) {
      const middle = energies[Math.floor((run.from + run.to) / 2)]!;
      found.push({ regime: middle > INTRINSIC_THRESHOLD_EV ? 'intrinsic' : 'freeze-out', run });
    }
  }
  return found;
}

/** The regime of the suggested window overlapping [minK, maxK] the most, or null. */
export function regimeOfWindow(
  windows: readonly SuggestedWindow[],
  minK: number,
  maxK: number,
): RegimeName | null {
  let best: RegimeName | null = null;
  let bestOverlap = 0;
  for (const w of windows) {
    const overlap = Math.min(maxK, w.maxK) - Math.max(minK, w.minK);
    if (overlap > bestOverlap) {
      bestOverlap = overlap;
      best = w.regime;
    }
  }
  return best;
}
