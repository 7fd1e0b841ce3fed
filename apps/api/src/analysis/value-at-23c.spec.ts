import type { AnalysisStep } from '@rhotrace/api-types';
import { seededNormal, seededRandom } from '@rhotrace/physics';
import { describe, expect, it } from 'vitest';
import { specCheck } from './spec-check';
import { uncertaintyBudget, type BudgetContext } from './spec-uncertainty';
import { MAX_DISTANCE_K, SPEC_TEMPERATURE_K, valueAt23C } from './value-at-23c';

const T0 = SPEC_TEMPERATURE_K;
/** 0.74 %/K near room temperature, the example (a lightly doped silicon wafer). */
const SLOPE_PER_K = 0.0074;
const exponential = (t: number) => 10 * Math.exp(SLOPE_PER_K * (t - T0));
/** Lattice-limited shape rho ~ T^2.4 (common practice, no source): curved in ln rho against T. */
const powerLaw = (t: number) => 10 * (t / T0) ** 2.4;

function steps(
  temperaturesK: readonly number[],
  model: (t: number) => number,
  spreadRelative = 0,
  count = 1,
): AnalysisStep[] {
  return temperaturesK.map((t) => ({
    temperatureK: t,
    resistivityOhmCm: model(t),
    spreadOhmCm: spreadRelative * model(t),
    count,
  }));
}

const range31 = Array.from({ length: 31 }, (_, i) => 281.15 + i);

const noRecords: BudgetContext = {
  method: 'resistivity',
  geometry: null,
  station: null,
  thicknessCm: null,
  thicknessToleranceCm: null,
};

describe('the 23 °C value (defect 6)', () => {
  it('corrects a sweep whose nearest step is 5 K away to within 0.5 % of the truth', () => {
    // Before the fix the nearest step (301.15 K) was taken as is: exp(0.0074 * 5) - 1 = 3.8 %.
    const temps = [301.15, 306.15, 311.15, 316.15];
    for (const model of [exponential, powerLaw]) {
      const v = valueAt23C(steps(temps, model));
      expect(v.method).toBe('corrected');
      expect(v.distanceK).toBeCloseTo(5, 9);
      expect(Math.abs(v.resistivityOhmCm! / model(T0) - 1)).toBeLessThan(0.005);
    }
    const nearestOnly = exponential(301.15) / exponential(T0) - 1;
    expect(nearestOnly).toBeGreaterThan(0.035);
  });

  it('corrects from below 23 °C too, and with two steps only', () => {
    const v = valueAt23C(steps([284.15, 289.15], exponential));
    expect(v.method).toBe('corrected');
    expect(v.resistivityOhmCm! / 10).toBeCloseTo(1, 9);
  });

  it('interpolates between bracketing steps (ln rho linear in T, exact for an exponential)', () => {
    const v = valueAt23C(steps([291.2, 301.1, 311], exponential));
    expect(v.method).toBe('interpolated');
    expect(v.resistivityOhmCm! / 10).toBeCloseTo(1, 12);
    expect(v.logSlopePerK).toBeCloseTo(SLOPE_PER_K, 12);
  });

  it('bounds the interpolation error by the parabola through a third step', () => {
    // T^2.4 is curved in ln rho: the interpolation is a little off, and the budget says how much.
    const v = valueAt23C(steps([286.15, 306.15, 316.15], powerLaw));
    const error = Math.abs(Math.log(v.resistivityOhmCm! / powerLaw(T0)));
    expect(v.correction!.distribution).toBe('rectangular');
    expect(error).toBeGreaterThan(0);
    expect(error).toBeLessThanOrEqual(v.correction!.relative * Math.sqrt(3) * 1.5);
  });

  it(`refuses a sweep whose nearest step is more than ${MAX_DISTANCE_K} K away, saying why`, () => {
    const v = valueAt23C(steps([T0 + 15.5, T0 + 30], exponential));
    expect(v.resistivityOhmCm).toBeNull();
    expect(v.method).toBeNull();
    expect(v.reason).toMatch(/15\.50 K away \(at most 15 K\)/);
    expect(valueAt23C(steps([T0 + 15, T0 + 20], exponential)).method).toBe('corrected');
  });

  it('uses the model ratio when the sweep has a single step near 23 °C', () => {
    const v = valueAt23C(steps([T0 + 6], exponential), exponential);
    expect(v.method).toBe('corrected');
    expect(v.resistivityOhmCm! / 10).toBeCloseTo(1, 9);
    expect(v.logSlopePerK).toBeCloseTo(SLOPE_PER_K, 6);
    const without = valueAt23C(steps([T0 + 6], exponential));
    expect(without.resistivityOhmCm).toBeNull();
    expect(without.reason).toMatch(/no model/);
  });
});

describe('the uncertainty budget (JCGM 100:2008) and the guard-banded verdict (JCGM 106:2012)', () => {
  const temps = [291.15, 301.15, 306.15];
  const value = valueAt23C(steps(temps, exponential, 0.002, 20));
  const ctx: BudgetContext = {
    method: 'four-point',
    geometry: { spacingCm: 0.1, thicknessCm: 0.05, sources: {} },
    station: {
      name: 'Bench 1',
      thermometer: 'platinum-rtd',
      probeSpacingToleranceCm: 0.001,
      temperatureToleranceK: null,
    },
    thicknessCm: 0.05,
    thicknessToleranceCm: 0.0025,
  };
  const u = uncertaintyBudget(value, ctx);
  const line = (source: string) => u.uncertaintyBudget.find((b) => b.source === source)!;

  it('takes the thermometer tolerance from IEC 60751 class B as a rectangular half-width', () => {
    // Steps used at 291.15 and 301.15 K: |t| up to 28 °C -> 0.3 + 0.005 * 28 = 0.44 K;
    // u = 0.44 / sqrt(3) (GUM 4.3.7), times the slope 0.74 %/K.
    expect(line('temperature-sensor').relative).toBeCloseTo(
      (SLOPE_PER_K * (0.3 + 0.005 * 28)) / Math.sqrt(3),
      6,
    );
  });

  it('assumes IEC 60584-1 class 2 for a thermocouple with no stated tolerance', () => {
    // Class 2 for types K, N and J: +/- max(2.5 °C, 0.0075 |t|) (IEC 60584-1, from memory).
    const tc = uncertaintyBudget(value, {
      ...ctx,
      station: { ...ctx.station!, thermometer: 'thermocouple' },
    }).uncertaintyBudget.find((b) => b.source === 'temperature-sensor')!;
    expect(tc.relative).toBeCloseTo((SLOPE_PER_K * 2.5) / Math.sqrt(3), 6);
    expect(tc.note).toMatch(/IEC 60584-1 class 2 assumed/);
    const stated = uncertaintyBudget(value, {
      ...ctx,
      station: { ...ctx.station!, temperatureToleranceK: 0.1 },
    }).uncertaintyBudget.find((b) => b.source === 'temperature-sensor')!;
    expect(stated.relative).toBeCloseTo((SLOPE_PER_K * 0.1) / Math.sqrt(3), 6);
  });

  it('gives repeatability as the standard error of the step means', () => {
    // Interpolation weight 0.5 on each step; each mean has 0.2 % / sqrt(20).
    expect(line('repeatability').relative).toBeCloseTo(
      Math.hypot(0.5, 0.5) * (0.002 / Math.sqrt(20)),
      9,
    );
  });

  it('treats the thickness tolerance as rectangular, with the thin-sample sensitivity', () => {
    // t/s = 0.5: the four-point result is nearly proportional to t (Valdes 1954 factor ~ 0.997).
    const t = line('thickness');
    expect(t.relative).toBeGreaterThan(0.98 * (0.0025 / Math.sqrt(3) / 0.05));
    expect(t.relative).toBeLessThan(1.0 * (0.0025 / Math.sqrt(3) / 0.05));
    // On a thin sheet the spacing barely matters (rho = 4.532 t V/I does not contain s), and
    // rho = (V/I) s G(t/s) makes the two sensitivities add to 1 (dimensional analysis, Valdes 1954).
    const cs = line('probe-spacing').relative / (0.001 / Math.sqrt(3) / 0.1);
    const ct = t.relative / (0.0025 / Math.sqrt(3) / 0.05);
    expect(cs).toBeLessThan(0.05);
    expect(cs + ct).toBeCloseTo(1, 6);
  });

  it('evaluates the sensitivities at the edge of the four-point range without failing', () => {
    // A diameter of exactly 3 spacings is the smallest the conversion takes (Smits 1958 slice).
    const edge = uncertaintyBudget(value, {
      ...ctx,
      geometry: { spacingCm: 0.1, thicknessCm: 0.05, diameterCm: 0.3, sources: {} },
    });
    const spacing = edge.uncertaintyBudget.find((b) => b.source === 'probe-spacing')!;
    expect(Number.isFinite(spacing.relative)).toBe(true);
    expect(spacing.relative).toBeGreaterThan(0);
  });

  it('combines the lines by root sum of squares and expands with k = 2', () => {
    const rss = Math.hypot(...u.uncertaintyBudget.map((b) => b.standardUncertaintyOhmCm));
    expect(u.coverageFactor).toBe(2);
    expect(u.uncertaintyOhmCm).toBeCloseTo(2 * rss, 12);
  });

  it('estimates the scatter of single-reading steps from their spread about the local line', () => {
    // 31 single readings 1 K apart with 0.3 % Gaussian noise (seeded): the residual standard
    // deviation about a straight line in ln rho estimates 0.3 % to about 13 % (chi-square, 29 dof).
    const normal = seededNormal(seededRandom(7));
    const noisy = range31.map((t) => ({
      temperatureK: t,
      resistivityOhmCm: exponential(t) * (1 + 0.003 * normal()),
      spreadOhmCm: 0,
      count: 1,
    }));
    const v = valueAt23C(noisy);
    expect(v.repeatability!.note).toMatch(/^Single readings per step/);
    expect(v.repeatability!.relative).toBeGreaterThan(0.002);
    expect(v.repeatability!.relative).toBeLessThan(0.004);
  });

  it('marks unstated tolerances as not assessed rather than inventing them', () => {
    const bare = uncertaintyBudget(value, noRecords);
    const thickness = bare.uncertaintyBudget.find((b) => b.source === 'thickness')!;
    expect(thickness.standardUncertaintyOhmCm).toBe(0);
    expect(thickness.note).toMatch(/^Not assessed/);
    expect(bare.uncertaintyBudget.some((b) => b.source === 'probe-spacing')).toBe(false);
  });

  it('is indeterminate when the value lies within its uncertainty of a limit', () => {
    const rho = value.resistivityOhmCm!;
    const U = u.uncertaintyOhmCm!;
    expect(specCheck(value, u, rho - 2 * U, rho + 0.5 * U)).toMatchObject({
      verdict: 'indeterminate',
      inSpec: false,
    });
    expect(specCheck(value, u, rho - 2 * U, rho + 2 * U)).toMatchObject({
      verdict: 'pass',
      inSpec: true,
    });
    expect(specCheck(value, u, rho + 1.5 * U, rho + 3 * U)).toMatchObject({
      verdict: 'fail',
      inSpec: false,
    });
    // Without the guard band the first case would have read "in spec".
    expect(rho).toBeLessThan(rho + 0.5 * U);
  });
});

describe('coverage of the expanded uncertainty (synthetic truth)', () => {
  it('covers the true 23 °C value in about 95 % of 400 seeded sweeps', () => {
    // Each sweep: 13 steps 2.5 K apart around 23 °C, 4 readings of 0.5 % noise each, and a
    // thermometer offset drawn uniformly within the IEC 60751 class B tolerance. k = 2 on a
    // budget dominated by normal repeatability should cover about 95 % (GUM 6.2.1); the band
    // 90-99 % allows for the rectangular sensor term and the finite number of trials.
    const uniform = seededRandom(2024);
    const normal = seededNormal(uniform);
    let covered = 0;
    const trials = 400;
    for (let trial = 0; trial < trials; trial += 1) {
      const offsetK = (2 * uniform() - 1) * (0.3 + 0.005 * 28);
      const sweep: AnalysisStep[] = [];
      for (let k = 0; k < 13; k += 1) {
        const reportedK = 281.35 + 2.5 * k;
        const readings = Array.from(
          { length: 4 },
          () => exponential(reportedK + offsetK) * (1 + 0.005 * normal()),
        );
        const mean = readings.reduce((a, b) => a + b, 0) / readings.length;
        const sd = Math.sqrt(readings.reduce((a, r) => a + (r - mean) ** 2, 0) / 3);
        sweep.push({ temperatureK: reportedK, resistivityOhmCm: mean, spreadOhmCm: sd, count: 4 });
      }
      const v = valueAt23C(sweep);
      const u = uncertaintyBudget(v, noRecords);
      if (Math.abs(v.resistivityOhmCm! - exponential(T0)) <= u.uncertaintyOhmCm!) covered += 1;
    }
    expect(covered / trials).toBeGreaterThanOrEqual(0.9);
    expect(covered / trials).toBeLessThanOrEqual(0.99);
  });
});
