import { describe, expect, it } from 'vitest';
import { regimeBoundaries } from '../semiconductor/regimes';
import { resistivity } from '../semiconductor/resistivity';
import { siliconDopantFromResistivity } from '../silicon/astm-f723';
import { planCurrentRanges, planProbeCurrent, type ProbeLimits } from './probe-current';
import {
  denseAround,
  MAX_PLAN_STEPS,
  PLAN_DEFAULTS,
  planTemperatureSteps,
  sweepDurationS,
} from './temperature-steps';

const meter = { targetVoltageV: 0.01, maxVoltageV: 0.1, maxPowerW: 0.01 };
const thinFourPoint = { method: 'four-point', ...meter } as const;

describe('planTemperatureSteps', () => {
  it('spaces 20-100 K in 10 steps evenly in 1/T (worked from the definition)', () => {
    // 1/T falls from 0.05 to 0.01 /K in 9 equal steps of 0.04/9 /K; values to 0.01 K.
    const steps = planTemperatureSteps({ minK: 20, maxK: 100, count: 10, spacing: 'inverse' });
    const expected = [20, 21.95, 24.32, 27.27, 31.03, 36.0, 42.86, 52.94, 69.23, 100];
    expect(steps).toHaveLength(10);
    steps.forEach((t, i) => expect(t).toBeCloseTo(expected[i]!, 2));
  });

  it('spaces linearly with both ends exact', () => {
    expect(planTemperatureSteps({ minK: 100, maxK: 300, count: 5, spacing: 'linear' })).toEqual([
      100, 150, 200, 250, 300,
    ]);
  });

  it('refuses minK >= maxK, a count outside 2..MAX_PLAN_STEPS and an unknown spacing', () => {
    const ok = { minK: 20, maxK: 100, count: 10, spacing: 'inverse' } as const;
    expect(() => planTemperatureSteps({ ...ok, minK: 100 })).toThrow(/minK below maxK/);
    expect(() => planTemperatureSteps({ ...ok, count: 1 })).toThrow(/count/);
    expect(() => planTemperatureSteps({ ...ok, count: MAX_PLAN_STEPS + 1 })).toThrow(/count/);
    expect(() => planTemperatureSteps({ ...ok, count: 2.5 })).toThrow(/whole/);
    expect(() => planTemperatureSteps({ ...ok, minK: 0 })).toThrow(/minK above 0/);
    expect(() => planTemperatureSteps({ ...ok, spacing: 'log' as unknown as 'linear' })).toThrow(
      /spacing/,
    );
  });
});

describe('denseAround', () => {
  it('adds steps at 0.9, 0.95, 1.05 and 1.1 of a boundary inside the range only', () => {
    expect(denseAround([100, 200, 300], [150, null, 1000])).toEqual([
      100, 135, 142.5, 157.5, 165, 200, 300,
    ]);
  });

  it('skips an extra step within 1 % of an existing one', () => {
    // 0.95 * 210.5 = 199.975 lies within 1 % of 200.
    expect(denseAround([100, 200, 300], [210.5])).not.toContain(0.95 * 210.5);
    expect(denseAround([100, 200, 300], [210.5])).toHaveLength(6);
  });
});

describe('sweepDurationS', () => {
  it('adds a dwell per step and the ramps out, between and back (worked by hand)', () => {
    // From 296.15 K to 196.15 K (100 K), to 96.15 K (100 K), back (200 K): 400 K at 5 K/min is
    // 80 min = 4800 s, plus 2 dwells of 60 s.
    expect(sweepDurationS([196.15, 96.15], { dwellS: 60, rampKPerMin: 5 })).toBeCloseTo(4920, 9);
  });

  it('uses the documented defaults', () => {
    const room = PLAN_DEFAULTS.roomTemperatureK;
    expect(sweepDurationS([room])).toBeCloseTo(PLAN_DEFAULTS.dwellS, 9);
    expect(sweepDurationS([room, room + PLAN_DEFAULTS.rampKPerMin], { dwellS: 0 })).toBeCloseTo(
      120,
      9,
    );
  });

  it('refuses a non-positive ramp and a negative dwell', () => {
    expect(() => sweepDurationS([300], { rampKPerMin: 0 })).toThrow(/rampKPerMin/);
    expect(() => sweepDurationS([300], { dwellS: -1 })).toThrow(/dwellS/);
  });
});

describe('planProbeCurrent', () => {
  it('gives 0.453 mA for 10 mV on 100 ohm/sq, thin large slice (worked from V = I R_s / 4.532)', () => {
    const p = planProbeCurrent({ ...thinFourPoint, sheetResistanceOhmSq: 100 });
    expect(p.currentA * 1e3).toBeCloseTo(0.453, 3);
    expect(p.voltageV).toBeCloseTo(0.01, 12);
    expect(p.powerW).toBeCloseTo(p.voltageV * p.currentA, 15);
    expect(p.limitedBy).toBe('target-voltage');
  });

  it('uses V = I R_s ln 2 / pi for van der Pauw (van der Pauw 1958, symmetric sample)', () => {
    const p = planProbeCurrent({ ...meter, method: 'van-der-pauw', sheetResistanceOhmSq: 100 });
    expect(p.currentA).toBeCloseTo(0.01 / ((100 * Math.LN2) / Math.PI), 12);
  });

  it('applies the finite-thickness and finite-diameter factors', () => {
    // Smits 1958: F(t/s = 0.5) = 0.9974 (from memory) and C(d/s = 10) = 4.1712.
    const thick = planProbeCurrent({
      ...thinFourPoint,
      sheetResistanceOhmSq: 100,
      spacingCm: 0.1,
      thicknessCm: 0.05,
    });
    expect(thick.currentA / (0.01 / (100 / (4.5324 * 0.9974)))).toBeCloseTo(1, 3);
    const small = planProbeCurrent({
      ...thinFourPoint,
      sheetResistanceOhmSq: 100,
      spacingCm: 0.1,
      diameterCm: 1,
    });
    expect(small.currentA / (0.01 / (100 / 4.1712))).toBeCloseTo(1, 4);
  });

  it('names every limit that can set the current', () => {
    const at = (rs: number, extra: Partial<ProbeLimits>) =>
      planProbeCurrent({ ...thinFourPoint, sheetResistanceOhmSq: rs, ...extra });
    expect(at(100, { targetVoltageV: 0.2 }).limitedBy).toBe('max-voltage');
    expect(at(100, { targetVoltageV: 0.2 }).voltageV).toBeCloseTo(0.1, 12);
    const hot = at(100, { maxPowerW: 1e-6 });
    expect(hot.limitedBy).toBe('max-power');
    expect(hot.powerW).toBeCloseTo(1e-6, 15);
    const capped = at(100, { maxCurrentA: 1e-4 });
    expect([capped.limitedBy, capped.currentA]).toEqual(['max-current', 1e-4]);
    const floor = at(1e9, { minCurrentA: 1e-9 });
    expect([floor.limitedBy, floor.currentA]).toEqual(['min-current', 1e-9]);
    expect(floor.voltageV).toBeGreaterThan(0.1);
  });

  it('refuses non-positive limits, naming them', () => {
    const base = { ...thinFourPoint, sheetResistanceOhmSq: 100 };
    expect(() => planProbeCurrent({ ...base, maxPowerW: 0 })).toThrow(/maxPowerW above 0/);
    expect(() => planProbeCurrent({ ...base, targetVoltageV: -1 })).toThrow(/targetVoltageV/);
    expect(() => planProbeCurrent({ ...base, sheetResistanceOhmSq: 0 })).toThrow(/sheetResist/);
    expect(() => planProbeCurrent({ ...base, minCurrentA: 2, maxCurrentA: 1 })).toThrow(/minCurr/);
  });
});

describe('planCurrentRanges', () => {
  it('holds one current while every voltage stays readable, then switches', () => {
    // Floor 0.1 mV, target 10 mV: one current serves resistances within a factor 100.
    const plan = planCurrentRanges([100, 1000, 5000, 1e5], thinFourPoint);
    expect(plan.ranges.map((r) => [r.fromIndex, r.toIndex])).toEqual([
      [0, 2],
      [3, 3],
    ]);
    expect(plan.steps[2]!.voltageV).toBeCloseTo(0.01, 12);
    for (const s of plan.steps) {
      expect(s.voltageV).toBeGreaterThanOrEqual(1e-4);
      expect(s.voltageV).toBeLessThanOrEqual(0.01 * (1 + 1e-12));
    }
  });

  it('keeps one range when the resistance barely changes', () => {
    const plan = planCurrentRanges([100, 120, 90], thinFourPoint);
    expect(plan.ranges).toHaveLength(1);
    expect(plan.steps.every((s) => s.currentA === plan.ranges[0]!.currentA)).toBe(true);
  });

  it('plans a 10 ohm cm, 500 um silicon wafer over 20-400 K within the meter and power', () => {
    // Boron density from ASTM F723 at 10 ohm cm; 1 mm probe spacing, 1 mW limit.
    const doping = { donorDensity: 0, acceptorDensity: siliconDopantFromResistivity('boron', 10) };
    const steps = planTemperatureSteps({ minK: 20, maxK: 400, count: 40, spacing: 'inverse' });
    const rs = steps.map((t) => resistivity('Si', doping, t) / 0.05);
    const limits = { ...thinFourPoint, maxPowerW: 1e-3, spacingCm: 0.1, thicknessCm: 0.05 };
    const plan = planCurrentRanges(rs, limits);
    expect(plan.ranges.length).toBeGreaterThan(1);
    for (const s of plan.steps) {
      expect(s.voltageV).toBeGreaterThanOrEqual(limits.maxVoltageV / 1000);
      expect(s.voltageV).toBeLessThanOrEqual(limits.maxVoltageV);
      expect(s.powerW).toBeLessThanOrEqual(limits.maxPowerW);
    }
    const freezeOutBelowK = regimeBoundaries('Si', doping).freezeOutBelowK!;
    const inverse = steps.filter((t) => t < freezeOutBelowK).map((t) => 1 / t);
    expect(inverse.length).toBeGreaterThan(5);
    const gaps = inverse.slice(1).map((v, i) => inverse[i]! - v);
    for (const g of gaps) expect(g / gaps[0]!).toBeCloseTo(1, 9);
  });
});
