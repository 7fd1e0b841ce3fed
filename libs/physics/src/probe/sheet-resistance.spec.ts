import { describe, expect, it } from 'vitest';
import { fourPointProbe } from './four-point';
import { resistivityFromSheetResistance } from './sheet-resistance';

describe('resistivityFromSheetResistance', () => {
  it('applies rho = R_s t', () => {
    // Definition of sheet resistance (common practice, no source): R_s = rho / t.
    // 45.3 ohm/sq * 0.05 cm = 2.265 ohm cm. Tolerance 1e-12.
    expect(
      resistivityFromSheetResistance({ sheetResistanceOhmSq: 45.3, thicknessCm: 0.05 }),
    ).toBeCloseTo(2.265, 12);
  });

  it('agrees with the four-point probe on a thin sheet, where the thickness factor is 1', () => {
    // Valdes 1954: for t << s, rho = (pi / ln 2) t V/I = R_s t. Tolerance 1e-9 relative.
    const probe = fourPointProbe({
      voltageV: 0.01,
      currentA: 0.001,
      spacingCm: 0.1,
      thicknessCm: 1e-4,
    });
    const rho = resistivityFromSheetResistance({
      sheetResistanceOhmSq: probe.sheetResistanceOhmSq,
      thicknessCm: 1e-4,
    });
    expect(rho / probe.resistivityOhmCm).toBeCloseTo(1, 9);
  });

  it('refuses a zero, negative or missing value, naming it', () => {
    expect(() =>
      resistivityFromSheetResistance({ sheetResistanceOhmSq: 0, thicknessCm: 1 }),
    ).toThrow(/resistivityFromSheetResistance.*sheetResistanceOhmSq/);
    expect(() =>
      resistivityFromSheetResistance({ sheetResistanceOhmSq: 10, thicknessCm: -1 }),
    ).toThrow(/thicknessCm/);
    expect(() =>
      resistivityFromSheetResistance({ sheetResistanceOhmSq: 10 } as unknown as {
        sheetResistanceOhmSq: number;
        thicknessCm: number;
      }),
    ).toThrow(/thicknessCm/);
  });
});
