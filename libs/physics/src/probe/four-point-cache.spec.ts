import fc from 'fast-check';
import { beforeEach, describe, expect, it } from 'vitest';
import {
  clearGeometryFactorCache,
  finiteThicknessFactor,
  fourPointProbe,
  THIN_SHEET_FACTOR,
  uncachedGeometryFactors,
} from './four-point';

/**
 * The memo of the geometry factors must not change a single bit of any result: every value is
 * compared with `Object.is` against the factors computed afresh (formula of `fourPointProbe`:
 * R_s = (pi / ln 2) D V/I, rho = R_s t F; Valdes 1954, Smits 1958).
 */
function expected(input: {
  voltageV: number;
  currentA: number;
  spacingCm: number;
  thicknessCm: number;
  diameterCm?: number;
}) {
  const { thicknessFactor, diameterFactor } = uncachedGeometryFactors(
    input.thicknessCm / input.spacingCm,
    input.diameterCm === undefined ? undefined : input.diameterCm / input.spacingCm,
  );
  const sheetResistanceOhmSq =
    THIN_SHEET_FACTOR * diameterFactor * (input.voltageV / input.currentA);
  return {
    sheetResistanceOhmSq,
    resistivityOhmCm: sheetResistanceOhmSq * input.thicknessCm * thicknessFactor,
    thicknessFactor,
    diameterFactor,
  };
}

const geometry = fc.record({
  voltageV: fc.double({ min: 1e-7, max: 10, noNaN: true }),
  currentA: fc.double({ min: 1e-9, max: 0.1, noNaN: true }),
  spacingCm: fc.double({ min: 0.01, max: 0.5, noNaN: true }),
  thicknessCm: fc.double({ min: 1e-5, max: 2, noNaN: true }),
  diameterSpacings: fc.option(fc.double({ min: 3, max: 2000, noNaN: true }), { nil: undefined }),
});

describe('fourPointProbe geometry-factor cache', () => {
  beforeEach(() => clearGeometryFactorCache());

  it('gives bit-identical results on a cache miss and on a hit', () => {
    fc.assert(
      fc.property(geometry, ({ diameterSpacings, ...g }) => {
        const input =
          diameterSpacings === undefined
            ? g
            : { ...g, diameterCm: diameterSpacings * g.spacingCm * (1 + 1e-9) };
        const want = expected(input);
        const miss = fourPointProbe(input);
        const hit = fourPointProbe(input);
        const hitOtherReading = fourPointProbe({ ...input, voltageV: input.voltageV * 3 });
        const wantOther = expected({ ...input, voltageV: input.voltageV * 3 });
        for (const key of Object.keys(want) as Array<keyof typeof want>) {
          expect(Object.is(miss[key], want[key])).toBe(true);
          expect(Object.is(hit[key], want[key])).toBe(true);
          expect(Object.is(hitOtherReading[key], wantOther[key])).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('stays identical after the bounded cache has been emptied and refilled', () => {
    const first = fourPointProbe({
      voltageV: 1,
      currentA: 1e-3,
      spacingCm: 0.1,
      thicknessCm: 0.05,
    });
    // More distinct thickness ratios than the cache holds.
    for (let k = 1; k <= 1000; k++) {
      const t = k * 1e-3;
      const r = fourPointProbe({ voltageV: 1, currentA: 1, spacingCm: 0.1, thicknessCm: t });
      expect(Object.is(r.thicknessFactor, uncachedGeometryFactors(t / 0.1).thicknessFactor)).toBe(
        true,
      );
    }
    const again = fourPointProbe({
      voltageV: 1,
      currentA: 1e-3,
      spacingCm: 0.1,
      thicknessCm: 0.05,
    });
    expect(again).toEqual(first);
    expect(Object.is(again.resistivityOhmCm, first.resistivityOhmCm)).toBe(true);
  });

  it('serves finiteThicknessFactor from the same cache without changing it', () => {
    for (const tau of [0.01, 0.5, 1, 3.7, 40]) {
      const fresh = uncachedGeometryFactors(tau).thicknessFactor;
      expect(Object.is(finiteThicknessFactor(tau), fresh)).toBe(true);
      expect(Object.is(finiteThicknessFactor(tau), fresh)).toBe(true);
    }
    // Smits 1958, F(1) = 0.9214 (tolerance 2e-4), as in four-point.spec.ts, through the cache.
    expect(Math.abs(finiteThicknessFactor(1) - 0.9214)).toBeLessThan(2e-4);
  });

  it('still validates every call, cached geometry or not', () => {
    const ok = { voltageV: 1, currentA: 1, spacingCm: 0.1, thicknessCm: 0.05 };
    fourPointProbe(ok);
    expect(() => fourPointProbe({ ...ok, currentA: 0 })).toThrow(/currentA/);
    expect(() => fourPointProbe({ ...ok, diameterCm: 0.29 })).toThrow(/3 probe spacings/);
    expect(() => finiteThicknessFactor(-1)).toThrow(RangeError);
  });
});
