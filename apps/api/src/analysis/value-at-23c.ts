/**
 * The resistivity of a sweep at 23 °C (296.15 K, the temperature ASTM F723 and the lot specs
 * refer to): interpolated between the steps either side of it, or corrected to it from the
 * nearest step with the local slope of ln(rho) against T, with what the budget needs to know.
 */
import type { AnalysisStep, ValueAt23CMethod } from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';

/** 23 °C in kelvin. */
export const SPEC_TEMPERATURE_K = PHYSICS_DEFAULTS.astmF723TemperatureK;
/** A step farther than this from 23 °C is not used to give a 23 °C value, K (inclusive). */
export const MAX_DISTANCE_K = 15;
/** Steps within this of 23 °C enter the local slope of ln(rho) against T, K (inclusive). */
export const SLOPE_SPAN_K = 25;
/**
 * Half-width of the correction's uncertainty, as a fraction of the correction, when the slope
 * has no statistics of its own (the model's ratio, or two single-reading steps). A stated
 * judgement (common practice, no source): a model's temperature coefficient near room
 * temperature is rarely better than this for a real wafer.
 */
export const UNASSESSED_SLOPE_FRACTION = 0.25;

/** Resistivity of the lot's model at a temperature, ohm cm; null when it has none there. */
export type ModelResistivity = (temperatureK: number) => number | null;

/** A relative standard uncertainty, its distribution and what it rests on. */
export interface RelativeUncertainty {
  relative: number;
  distribution: 'normal' | 'rectangular';
  note: string;
}

/** The 23 °C value of a sweep, how it was obtained and what its uncertainty rests on. */
export interface ValueAt23C {
  resistivityOhmCm: number | null;
  method: ValueAt23CMethod | null;
  /** Distance of the nearest step from 296.15 K. */
  distanceK: number | null;
  reason: string | null;
  /** d ln(rho) / dT at 23 °C, 1/K (the sensitivity to a temperature error). */
  logSlopePerK: number | null;
  /** Temperatures of the steps the value rests on, K. */
  usedTemperaturesK: number[];
  repeatability: RelativeUncertainty | null;
  correction: RelativeUncertainty | null;
}

const noValue = (reason: string, distanceK: number | null): ValueAt23C => ({
  resistivityOhmCm: null,
  method: null,
  distanceK,
  reason,
  logSlopePerK: null,
  usedTemperaturesK: [],
  repeatability: null,
  correction: null,
});

/**
 * Relative standard uncertainty of each step's mean: its own scatter, else the within-step
 * scatter pooled over the sweep, else `fallbackSd` (the relative scatter of single readings).
 */
function stepRelativeUncertainties(
  steps: readonly AnalysisStep[],
  fallbackSd: number | null,
): { u: Array<number | null>; source: 'within' | 'line' | null } {
  let sum = 0;
  let dof = 0;
  for (const s of steps) {
    if (s.count > 1) {
      sum += (s.count - 1) * (s.spreadOhmCm / s.resistivityOhmCm) ** 2;
      dof += s.count - 1;
    }
  }
  const pooled = dof > 0 ? Math.sqrt(sum / dof) : fallbackSd;
  return {
    u: steps.map((s) => {
      const sd = s.count > 1 ? s.spreadOhmCm / s.resistivityOhmCm : pooled;
      return sd === null ? null : sd / Math.sqrt(s.count);
    }),
    source: dof > 0 ? 'within' : pooled === null ? null : 'line',
  };
}

/** Least squares of ln(rho) against T: slope and its standard error (null below 3 points). */
function logSlope(steps: readonly AnalysisStep[]): {
  slope: number;
  se: number | null;
  /** Standard deviation of ln(rho) about the line (null below 3 points). */
  residualSd: number | null;
} {
  const n = steps.length;
  const xs = steps.map((s) => s.temperatureK);
  const ys = steps.map((s) => Math.log(s.resistivityOhmCm));
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const my = ys.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (xs[i]! - mx) ** 2;
    sxy += (xs[i]! - mx) * (ys[i]! - my);
  }
  const slope = sxy / sxx;
  if (n < 3) return { slope, se: null, residualSd: null };
  let sse = 0;
  for (let i = 0; i < n; i++) sse += (ys[i]! - my - slope * (xs[i]! - mx)) ** 2;
  return { slope, se: Math.sqrt(sse / (n - 2) / sxx), residualSd: Math.sqrt(sse / (n - 2)) };
}

/** ln(rho) at T on the parabola through three steps (Lagrange form). */
function parabolaLn(a: AnalysisStep, b: AnalysisStep, c: AnalysisStep, t: number): number {
  const [xa, xb, xc] = [a.temperatureK, b.temperatureK, c.temperatureK];
  const [ya, yb, yc] = [a, b, c].map((s) => Math.log(s.resistivityOhmCm)) as [
    number,
    number,
    number,
  ];
  return (
    (ya * (t - xb) * (t - xc)) / ((xa - xb) * (xa - xc)) +
    (yb * (t - xa) * (t - xc)) / ((xb - xa) * (xb - xc)) +
    (yc * (t - xa) * (t - xb)) / ((xc - xa) * (xc - xb))
  );
}

const pct = (x: number) => `${(100 * x).toPrecision(2)} %`;

/**
 * Resistivity at 23 °C from averaged steps sorted by temperature (GUM-style inputs for the
 * budget beside it):
 * - interpolated, linear in ln(rho) against T, between the steps either side of 296.15 K when
 *   both lie within `MAX_DISTANCE_K`; the interpolation error is bounded by the parabola
 *   through a third nearby step (rectangular);
 * - otherwise corrected from the nearest step (within `MAX_DISTANCE_K`) with the local slope of
 *   ln(rho) against T (least squares over the steps within `SLOPE_SPAN_K`; its standard error,
 *   times the distance, is the correction's uncertainty), or with the model's ratio
 *   rho(296.15 K) / rho(T) when that span holds a single step;
 * - none, with the reason, when every step is farther than `MAX_DISTANCE_K`.
 */
export function valueAt23C(
  steps: readonly AnalysisStep[],
  model: ModelResistivity | null = null,
): ValueAt23C {
  if (steps.length === 0) return noValue('The sweep has no usable points', null);
  const t0 = SPEC_TEMPERATURE_K;
  const distance = (s: AnalysisStep) => Math.abs(s.temperatureK - t0);
  const byDistance = steps.map((s, i) => ({ s, i })).sort((a, b) => distance(a.s) - distance(b.s));
  const nearest = byDistance[0]!;
  const distanceK = distance(nearest.s);
  if (distanceK > MAX_DISTANCE_K) {
    return noValue(
      `The sweep does not reach 23 °C: its nearest step is ${distanceK.toFixed(2)} K away ` +
        `(at most ${MAX_DISTANCE_K} K)`,
      distanceK,
    );
  }
  const local = steps.filter((s) => distance(s) <= SLOPE_SPAN_K);
  const fit = local.length >= 2 ? logSlope(local) : null;
  const { u: uSteps, source } = stepRelativeUncertainties(steps, fit?.residualSd ?? null);
  const repeatabilityNote = (u: number | null) =>
    u === null
      ? null
      : source === 'within'
        ? 'Scatter of the readings within the step(s) used (standard error of the mean; ' +
          'pooled over the sweep where a step has one reading)'
        : `Single readings per step: their scatter about a straight line in ln ρ against T ` +
          `over the ${local.length} steps within ${SLOPE_SPAN_K} K of 23 °C`;

  let below = -1;
  for (let i = 0; i < steps.length; i++) if (steps[i]!.temperatureK <= t0) below = i;
  const above = steps.findIndex((s) => s.temperatureK >= t0);
  const a = steps[below];
  const b = steps[above];
  if (a && b && distance(a) <= MAX_DISTANCE_K && distance(b) <= MAX_DISTANCE_K) {
    const span = b.temperatureK - a.temperatureK;
    const w = span === 0 ? 0 : (t0 - a.temperatureK) / span;
    const ln = Math.log(a.resistivityOhmCm) + w * Math.log(b.resistivityOhmCm / a.resistivityOhmCm);
    const ua = uSteps[below]!;
    const ub = uSteps[above]!;
    const uRep = ua === null || ub === null ? null : Math.hypot((1 - w) * ua, w * ub);
    const slope = span > 0 ? Math.log(b.resistivityOhmCm / a.resistivityOhmCm) / span : fit?.slope;
    const third = byDistance.find(
      (x) => x.i !== below && x.i !== above && distance(x.s) <= SLOPE_SPAN_K,
    );
    const curvature = third && span > 0 ? Math.abs(parabolaLn(a, b, third.s, t0) - ln) : null;
    return {
      resistivityOhmCm: Math.exp(ln),
      method: 'interpolated',
      distanceK,
      reason: null,
      logSlopePerK: slope ?? null,
      usedTemperaturesK: span === 0 ? [a.temperatureK] : [a.temperatureK, b.temperatureK],
      repeatability:
        uRep === null
          ? null
          : { relative: uRep, distribution: 'normal', note: repeatabilityNote(uRep)! },
      correction:
        span === 0
          ? { relative: 0, distribution: 'normal', note: 'A step lies at 23 °C: no interpolation' }
          : curvature === null
            ? null
            : {
                relative: curvature / Math.sqrt(3),
                distribution: 'rectangular',
                note:
                  `Linear interpolation of ln ρ between steps ${span.toFixed(2)} K apart; ` +
                  `half-width ${pct(curvature)}, the difference from a parabola through a third step`,
              },
    };
  }

  const n = nearest.s;
  const dT = t0 - n.temperatureK;
  const uRep = uSteps[nearest.i]!;
  const base = {
    method: 'corrected' as const,
    distanceK,
    reason: null,
    usedTemperaturesK: [n.temperatureK],
    repeatability:
      uRep === null
        ? null
        : { relative: uRep, distribution: 'normal' as const, note: repeatabilityNote(uRep)! },
  };
  if (fit) {
    // Two steps: the slope's uncertainty follows from the two means' own uncertainties.
    const [p, q] = local.map((s) => uSteps[steps.indexOf(s)] ?? null);
    const gap = Math.abs(local[local.length - 1]!.temperatureK - local[0]!.temperatureK);
    const uSlope = fit.se ?? (p == null || q == null ? null : Math.hypot(p, q) / gap);
    const correction = fit.slope * dT;
    return {
      ...base,
      resistivityOhmCm: n.resistivityOhmCm * Math.exp(correction),
      logSlopePerK: fit.slope,
      correction:
        uSlope === null
          ? {
              relative: (UNASSESSED_SLOPE_FRACTION * Math.abs(correction)) / Math.sqrt(3),
              distribution: 'rectangular',
              note:
                `Corrected ${pct(correction)} over ${Math.abs(dT).toFixed(2)} K with the slope of ` +
                `two single-reading steps; half-width ${UNASSESSED_SLOPE_FRACTION * 100} % of it`,
            }
          : {
              relative: Math.abs(dT) * uSlope,
              distribution: 'normal',
              note:
                `Corrected ${pct(correction)} over ${Math.abs(dT).toFixed(2)} K with the local ` +
                `slope of ln ρ against T from ${local.length} steps ` +
                `(${pct(fit.slope)}/K ± ${pct(uSlope)}/K)`,
            },
    };
  }
  const atStep = model?.(n.temperatureK) ?? null;
  const at23 = model?.(t0) ?? null;
  const hi = model?.(t0 + 0.5) ?? null;
  const lo = model?.(t0 - 0.5) ?? null;
  if (atStep === null || at23 === null || hi === null || lo === null) {
    return noValue(
      `The sweep has one step within ${SLOPE_SPAN_K} K of 23 °C (at ` +
        `${n.temperatureK.toFixed(2)} K) and the lot has no model to correct it with`,
      distanceK,
    );
  }
  const correction = Math.log(at23 / atStep);
  return {
    ...base,
    resistivityOhmCm: n.resistivityOhmCm * (at23 / atStep),
    logSlopePerK: Math.log(hi / lo),
    correction: {
      relative: (UNASSESSED_SLOPE_FRACTION * Math.abs(correction)) / Math.sqrt(3),
      distribution: 'rectangular',
      note:
        `Corrected ${pct(correction)} over ${Math.abs(dT).toFixed(2)} K with the model's ratio ` +
        `ρ(296.15 K)/ρ(T) (one step near 23 °C); half-width ${UNASSESSED_SLOPE_FRACTION * 100} % of it`,
    },
  };
}
