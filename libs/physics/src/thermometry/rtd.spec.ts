import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PHYSICS_DEFAULTS } from '../defaults';
import { rtdResistance, rtdTemperatureK } from './rtd';

describe('rtdResistance', () => {
  it('reproduces the IEC 60751 Pt100 table', () => {
    // IEC 60751 table: 100.00 ohm at 0 °C, 138.51 at 100 °C, 18.52 at -200 °C, 390.48 at 850 °C
    // (the last from memory). Tolerance 0.005 ohm (table rounding).
    expect(PHYSICS_DEFAULTS.rtdR0Ohm).toBe(100);
    expect(rtdResistance(273.15)).toBeCloseTo(100, 9);
    expect(Math.abs(rtdResistance(373.15) - 138.51)).toBeLessThan(0.005);
    expect(Math.abs(rtdResistance(-200 + 273.15) - 18.52)).toBeLessThan(0.005);
    expect(Math.abs(rtdResistance(850 + 273.15) - 390.48)).toBeLessThan(0.005);
    expect(Math.abs(rtdResistance(373.15, 1000) - 1385.1)).toBeLessThan(0.05);
  });

  it('has the mean coefficient 0.00385 /°C between 0 °C and 100 °C', () => {
    // IEC 60751: alpha = (R100 - R0) / (100 R0) = 0.00385. Tolerance 1e-6.
    expect(Math.abs((rtdResistance(373.15) - 100) / 1e4 - 0.00385)).toBeLessThan(1e-6);
  });

  it('rises monotonically over the range', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 73.15, max: 1123.1, noNaN: true }),
        (t) => rtdResistance(t + 0.05) > rtdResistance(t),
      ),
    );
  });
});

describe('rtdTemperatureK', () => {
  it('inverts the IEC 60751 table values', () => {
    // IEC 60751 table: 138.51 ohm is 100 °C to within the table's 0.01 ohm (0.026 K).
    expect(Math.abs(rtdTemperatureK(138.51) - 373.15)).toBeLessThan(0.03);
    expect(Math.abs(rtdTemperatureK(18.52) - 73.15)).toBeLessThan(0.03);
    expect(rtdTemperatureK(100)).toBeCloseTo(273.15, 9);
  });

  it('round-trips rtdResistance to 1e-9 K over -200 °C to 850 °C', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 73.15, max: 1123.15, noNaN: true }),
        fc.constantFrom(100, 1000),
        (t, r0) => Math.abs(rtdTemperatureK(rtdResistance(t, r0), r0) - t) < 1e-9,
      ),
    );
  });
});

describe('rtd invalid inputs', () => {
  it('rejects temperatures outside -200 °C to 850 °C beyond the 1e-9 K allowance', () => {
    expect(() => rtdResistance(-200 + 273.15 - 1e-6)).toThrow(/`rtdResistance`.*temperatureK/);
    expect(() => rtdResistance(1123.16)).toThrow(RangeError);
    expect(() => rtdResistance(-200 + 273.15 - 1e-10)).not.toThrow();
    expect(() => rtdResistance(300, 0)).toThrow(/r0Ohm/);
    expect(() => rtdResistance(Number.NaN)).toThrow(RangeError);
  });
  it('rejects resistances outside the range and bad R0', () => {
    expect(() => rtdTemperatureK(18.4)).toThrow(/`rtdTemperatureK`.*resistanceOhm/);
    expect(() => rtdTemperatureK(391)).toThrow(RangeError);
    expect(() => rtdTemperatureK(100, -100)).toThrow(/r0Ohm/);
    expect(() => rtdTemperatureK('100' as unknown as number)).toThrow(TypeError);
  });
});
