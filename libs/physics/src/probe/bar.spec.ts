import { describe, expect, it } from 'vitest';
import { barResistivity } from './bar';

describe('barResistivity', () => {
  it('applies rho = (V/I) w t / L', () => {
    // Definition of resistivity (common practice, no source): R = rho L / (w t).
    // 0.5 V / 1 mA = 500 ohm; 500 * 0.2 * 0.05 / 1 = 5 ohm cm. Tolerance 1e-12.
    const rho = barResistivity({
      voltageV: 0.5,
      currentA: 0.001,
      lengthCm: 1,
      widthCm: 0.2,
      thicknessCm: 0.05,
    });
    expect(rho).toBeCloseTo(5, 12);
  });
  it('doubles when the taps are half as far apart', () => {
    const a = barResistivity({ voltageV: 1, currentA: 1, lengthCm: 2, widthCm: 1, thicknessCm: 1 });
    const b = barResistivity({ voltageV: 1, currentA: 1, lengthCm: 1, widthCm: 1, thicknessCm: 1 });
    expect(b / a).toBeCloseTo(2, 12);
  });
});

describe('barResistivity invalid inputs', () => {
  const ok = { voltageV: 1, currentA: 1, lengthCm: 1, widthCm: 1, thicknessCm: 1 };
  it('rejects bad readings and geometry', () => {
    expect(() => barResistivity({ ...ok, currentA: 0 })).toThrow(/`barResistivity`.*currentA/);
    expect(() => barResistivity({ ...ok, lengthCm: 0 })).toThrow(/lengthCm/);
    expect(() => barResistivity({ ...ok, widthCm: -1 })).toThrow(/widthCm/);
    expect(() => barResistivity({ ...ok, thicknessCm: Number.POSITIVE_INFINITY })).toThrow(
      RangeError,
    );
  });
});
