import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  circularSliceFactor,
  finiteThicknessFactor,
  fourPointProbe,
  THIN_SHEET_FACTOR,
} from './four-point';

/** Brute-force image series (2e6 direct terms), an independent check of the tail treatment. */
function bruteForceFactor(tau: number): number {
  let sum = 0;
  for (let k = 1; k <= 2_000_000; k++) {
    const u = 2 * k * tau;
    sum += 1 / Math.sqrt(1 + u * u) - 1 / Math.sqrt(4 + u * u);
  }
  return (2 * Math.LN2) / (tau * (1 + 4 * sum));
}

describe('fourPointProbe', () => {
  it('uses pi / ln 2 = 4.5324 for a thin, large sheet', () => {
    // Valdes 1954 / Smits 1958: R_s = 4.5324 V/I. Tolerance 1e-4.
    expect(THIN_SHEET_FACTOR).toBeCloseTo(4.5324, 4);
    const r = fourPointProbe({
      voltageV: 0.002,
      currentA: 0.001,
      spacingCm: 0.1,
      thicknessCm: 1e-5,
    });
    expect(r.sheetResistanceOhmSq).toBeCloseTo(2 * 4.53236, 4);
    expect(r.diameterFactor).toBe(1);
    expect(r.thicknessFactor).toBeCloseTo(1, 9);
    expect(r.resistivityOhmCm).toBeCloseTo(r.sheetResistanceOhmSq * 1e-5 * r.thicknessFactor, 15);
  });

  it('matches the Smits 1958 finite-thickness table', () => {
    // Smits 1958, Bell Syst. Tech. J. 37, 711, F(w/s) for an insulating base (from memory):
    // 0.5 -> 0.9974, 1.0 -> 0.9214, 2.0 -> 0.6336. Tolerance 2e-4.
    expect(finiteThicknessFactor(0.5)).toBeCloseTo(0.9974, 3);
    expect(Math.abs(finiteThicknessFactor(1) - 0.9214)).toBeLessThan(2e-4);
    expect(Math.abs(finiteThicknessFactor(2) - 0.6336)).toBeLessThan(2e-4);
  });

  it('agrees with a brute-force sum of the image series', () => {
    for (const tau of [0.05, 0.3, 1, 4]) {
      expect(finiteThicknessFactor(tau) / bruteForceFactor(tau)).toBeCloseTo(1, 9);
    }
  });

  it('lies above the closed form, which is about 4 % low at t/s = 0.5', () => {
    // REFERENCES (after Valdes; Smits): (t/s) / (2 ln[sinh(t/s) / sinh(t/2s)]) is about 4 % low.
    const tau = 0.5;
    const closed =
      (tau / (2 * Math.log(Math.sinh(tau) / Math.sinh(tau / 2)))) * ((2 * Math.LN2) / tau);
    const ratio = closed / finiteThicknessFactor(tau);
    expect(ratio).toBeGreaterThan(0.95);
    expect(ratio).toBeLessThan(0.97);
  });

  it('tends to the semi-infinite result rho = 2 pi s V/I for a thick block', () => {
    // Valdes 1954, Proc. IRE 42, 420. Tolerance 0.1 % at t/s = 50.
    const r = fourPointProbe({ voltageV: 1, currentA: 1, spacingCm: 0.1, thicknessCm: 5 });
    expect(r.resistivityOhmCm / (2 * Math.PI * 0.1)).toBeCloseTo(1, 3);
  });

  it('applies the Smits circular-slice correction', () => {
    // Smits 1958 circle table (from memory): d/s = 3 -> 2.2662, d/s = 10 -> 4.1712 (the formula
    // of REFERENCES evaluated by hand gives 4.17116). Tolerance 1e-3.
    expect(circularSliceFactor(3)).toBeCloseTo(2.2662, 3);
    expect(circularSliceFactor(10)).toBeCloseTo(4.1712, 3);
    const r = fourPointProbe({
      voltageV: 1,
      currentA: 1,
      spacingCm: 0.1,
      thicknessCm: 1e-4,
      diameterCm: 1,
    });
    expect(r.diameterFactor * THIN_SHEET_FACTOR).toBeCloseTo(circularSliceFactor(10), 12);
    expect(r.sheetResistanceOhmSq).toBeCloseTo(circularSliceFactor(10), 12);
  });

  it('has corrections that grow towards 1 for larger slices and thinner wafers', () => {
    fc.assert(
      fc.property(fc.double({ min: 3, max: 1000, noNaN: true }), (r) => {
        const a = circularSliceFactor(r);
        return a < circularSliceFactor(r * 1.1) && a < THIN_SHEET_FACTOR;
      }),
    );
    fc.assert(
      // Below t/s of about 0.2 the correction differs from 1 by less than rounding.
      fc.property(fc.double({ min: 0.001, max: 20, noNaN: true }), (tau) => {
        const f = finiteThicknessFactor(tau);
        return f <= 1 + 1e-12 && (tau < 0.2 || finiteThicknessFactor(tau * 1.2) < f);
      }),
    );
  });
});

describe('fourPointProbe invalid inputs', () => {
  const ok = { voltageV: 1, currentA: 1, spacingCm: 0.1, thicknessCm: 0.05 };
  it('rejects bad readings and geometry', () => {
    expect(() => fourPointProbe({ ...ok, currentA: 0 })).toThrow(/`fourPointProbe`.*currentA/);
    expect(() => fourPointProbe({ ...ok, voltageV: -1 })).toThrow(RangeError);
    expect(() => fourPointProbe({ ...ok, spacingCm: 0 })).toThrow(/spacingCm/);
    expect(() => fourPointProbe({ ...ok, thicknessCm: Number.NaN })).toThrow(/thicknessCm/);
    expect(() => fourPointProbe({ ...ok, voltageV: '1' as unknown as number })).toThrow(TypeError);
    expect(() => fourPointProbe(null as unknown as typeof ok)).toThrow(TypeError);
  });
  it('rejects a slice under 3 probe spacings', () => {
    expect(() => fourPointProbe({ ...ok, diameterCm: 0.29 })).toThrow(
      /diameterCm.*3 probe spacings/,
    );
    expect(() => circularSliceFactor(2.9)).toThrow(RangeError);
    expect(() => fourPointProbe({ ...ok, diameterCm: 0.3 })).not.toThrow();
  });
});
