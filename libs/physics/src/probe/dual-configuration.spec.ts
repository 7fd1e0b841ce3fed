import { describe, expect, it } from 'vitest';
import { dualConfiguration, DUAL_CONFIGURATION_IDEAL_RATIO } from './dual-configuration';

describe('dualConfiguration', () => {
  it('has the ideal ratio 1.2619 and R_s / R_a = 4.535 there', () => {
    // Rymaszewski 1969 (J. Phys. E 2, 170) and SEMI MF1529: ideal R_a / R_b = 1.2619,
    // R_s / R_a = 4.535 at that ratio.
    expect(DUAL_CONFIGURATION_IDEAL_RATIO).toBeCloseTo(1.2619, 4);
    const out = dualConfiguration({ resistanceAOhm: 2, resistanceBOhm: 2 / 1.2619 });
    expect(out.factor).toBeCloseTo(4.535, 3);
    expect(out.sheetResistanceOhmSq).toBeCloseTo(2 * 4.535, 2);
  });

  it('recovers R_s of an infinite sheet from its two configurations', () => {
    // Infinite thin sheet (Valdes 1954; Rymaszewski 1969): R_a = R_s ln 2 / pi,
    // R_b = R_s ln 3 / (2 pi). The fitted relation reproduces R_s to 0.1 %.
    const rs = 37.5;
    const out = dualConfiguration({
      resistanceAOhm: (rs * Math.LN2) / Math.PI,
      resistanceBOhm: (rs * Math.log(3)) / (2 * Math.PI),
    });
    expect(Math.abs(out.sheetResistanceOhmSq / rs - 1)).toBeLessThan(1e-3);
  });

  it('refuses a ratio no geometry gives, naming both readings', () => {
    expect(() => dualConfiguration({ resistanceAOhm: 1, resistanceBOhm: 2 })).toThrow(
      /`dualConfiguration`.*R_a \/ R_b/,
    );
    expect(() => dualConfiguration({ resistanceAOhm: 0, resistanceBOhm: 2 })).toThrow(
      /resistanceAOhm/,
    );
  });
});
