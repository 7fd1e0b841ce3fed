import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { vanDerPauw } from './van-der-pauw';

describe('vanDerPauw', () => {
  it('gives R_s = (pi / ln 2) R for a symmetric sample', () => {
    // Van der Pauw 1958, Philips Res. Rep. 13, 1. Tolerance 1e-12 relative.
    const r = vanDerPauw({ resistanceAOhm: 10, resistanceBOhm: 10, thicknessCm: 0.05 });
    expect(r.correctionFactor).toBe(1);
    expect(r.sheetResistanceOhmSq / ((Math.PI / Math.LN2) * 10)).toBeCloseTo(1, 12);
    expect(r.resistivityOhmCm).toBeCloseTo(r.sheetResistanceOhmSq * 0.05, 12);
  });

  it('gives f of about 0.7 at a ratio of 10', () => {
    // Van der Pauw 1958, f against R_A/R_B: about 0.70 at 10. Tolerance 0.01.
    expect(
      Math.abs(vanDerPauw({ resistanceAOhm: 10, resistanceBOhm: 1 }).correctionFactor - 0.7),
    ).toBeLessThan(0.01);
  });

  it('solves the van der Pauw equation to 1e-12 for any ratio', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        fc.double({ min: -6, max: 6, noNaN: true }),
        (ra, logRatio) => {
          const rb = ra * 10 ** logRatio;
          const { sheetResistanceOhmSq: rs, resistivityOhmCm } = vanDerPauw({
            resistanceAOhm: ra,
            resistanceBOhm: rb,
          });
          const lhs = Math.exp((-Math.PI * ra) / rs) + Math.exp((-Math.PI * rb) / rs);
          return Math.abs(lhs - 1) < 1e-12 && resistivityOhmCm === undefined;
        },
      ),
    );
  });

  it('has f symmetric in the ratio and falling away from 1', () => {
    const f = (r: number): number =>
      vanDerPauw({ resistanceAOhm: r, resistanceBOhm: 1 }).correctionFactor;
    expect(f(5)).toBeCloseTo(f(0.2), 12);
    expect(f(100)).toBeLessThan(f(10));
  });
});

describe('vanDerPauw invalid inputs', () => {
  it('rejects bad resistances and thickness', () => {
    expect(() => vanDerPauw({ resistanceAOhm: 0, resistanceBOhm: 1 })).toThrow(
      /`vanDerPauw`.*resistanceAOhm/,
    );
    expect(() => vanDerPauw({ resistanceAOhm: 1, resistanceBOhm: -1 })).toThrow(RangeError);
    expect(() => vanDerPauw({ resistanceAOhm: 1, resistanceBOhm: 1, thicknessCm: 0 })).toThrow(
      /thicknessCm/,
    );
    expect(() => vanDerPauw({ resistanceAOhm: 1e13, resistanceBOhm: 1e-3 })).toThrow(RangeError);
    expect(() =>
      vanDerPauw({ resistanceAOhm: 'a' as unknown as number, resistanceBOhm: 1 }),
    ).toThrow(TypeError);
  });
});
