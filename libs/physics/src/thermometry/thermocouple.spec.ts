import { describe, expect, it } from 'vitest';
import { PhysicsInputError } from '../errors';
import { THERMOCOUPLE_REFERENCE, THERMOCOUPLE_TYPES } from './thermocouple-coefficients';
import {
  THERMOCOUPLE_INVERSE_RANGE_CELSIUS,
  thermocoupleEmfMv,
  thermocoupleTemperatureK,
} from './thermocouple';

const k = (celsius: number) => celsius + 273.15;

describe('thermocoupleEmfMv', () => {
  it('reproduces the NIST Monograph 175 tables (0 °C reference)', () => {
    // NIST Monograph 175 (1993) tables, printed to 1 µV, from memory: tolerance 0.0005 mV.
    const table: Array<[Parameters<typeof thermocoupleEmfMv>[0], number, number]> = [
      ['K', 100, 4.096],
      ['K', 400, 16.397],
      ['K', 1000, 41.276],
      ['T', 100, 4.279],
      ['T', -200, -5.603],
      ['T', 400, 20.872],
      ['E', 100, 6.319],
      ['E', 1000, 76.373],
      ['J', 100, 5.269],
      ['J', 760, 42.919],
      ['N', 1000, 36.256],
      ['R', 1000, 10.506],
      ['S', 1000, 9.587],
      ['B', 1000, 4.834],
    ];
    for (const [type, celsius, emf] of table) {
      expect(
        Math.abs(thermocoupleEmfMv(type, k(celsius)) - emf),
        `${type} ${celsius}`,
      ).toBeLessThan(0.0005);
    }
  });

  it('is zero at 0 °C and continuous where the published ranges meet', () => {
    // Common practice, no source: the piecewise reference functions join within a microvolt;
    // a mistyped coefficient breaks the join.
    for (const type of THERMOCOUPLE_TYPES) {
      const ranges = THERMOCOUPLE_REFERENCE[type];
      if (type !== 'R' && type !== 'S')
        expect(Math.abs(thermocoupleEmfMv(type, 273.15))).toBeLessThan(1e-6);
      for (let i = 1; i < ranges.length; i++) {
        const at = ranges[i]!.minCelsius;
        const below = thermocoupleEmfMv(type, k(at) - 1e-6);
        const above = thermocoupleEmfMv(type, k(at) + 1e-6);
        expect(Math.abs(above - below), `${type} at ${at} °C`).toBeLessThan(1e-5);
      }
    }
  });

  it('refuses a temperature outside the type range', () => {
    expect(() => thermocoupleEmfMv('T', k(401))).toThrow(PhysicsInputError);
    expect(() => thermocoupleEmfMv('X' as 'K', 300)).toThrow(/one of B, E, J, K, N, R, S, T/);
  });
});

describe('thermocoupleTemperatureK', () => {
  it('inverts the forward function over each type range well within the published inverse-fit error', () => {
    // NIST Monograph 175: the inverse polynomials agree with the reference functions to about
    // 0.05 °C (K); the numerical inverse here must do better than 0.001 K.
    for (const type of THERMOCOUPLE_TYPES) {
      const [lo, hi] = THERMOCOUPLE_INVERSE_RANGE_CELSIUS[type];
      for (let i = 0; i <= 40; i++) {
        const t = k(lo + ((hi - lo) * i) / 40);
        const back = thermocoupleTemperatureK(type, thermocoupleEmfMv(type, t));
        expect(Math.abs(back - t), `${type} at ${t} K`).toBeLessThan(1e-3);
      }
    }
  });

  it('compensates the cold junction: K reading 1.000 mV with the junction at 23 °C is about 47.5 °C', () => {
    // Worked from the reference functions: E(23 °C) = 0.919 mV, 1.919 mV is 47.48 °C (NIST K table).
    const t = thermocoupleTemperatureK('K', 1.0, k(23));
    expect(Math.abs(t - k(47.48))).toBeLessThan(0.02);
    expect(thermocoupleTemperatureK('K', 4.096)).toBeCloseTo(k(100), 1);
  });

  it('refuses an EMF beyond the inverse range, naming the limits', () => {
    expect(() => thermocoupleTemperatureK('T', 25)).toThrow(/between -5\.603 and 20\.872 mV/);
    expect(() => thermocoupleTemperatureK('B', 0.1)).toThrow(PhysicsInputError);
    expect(() => thermocoupleTemperatureK('K', 1, 2000)).toThrow(/referenceJunctionK/);
  });
});
