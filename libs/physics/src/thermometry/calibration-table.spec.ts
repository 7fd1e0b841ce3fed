import { describe, expect, it } from 'vitest';
import { PhysicsInputError } from '../errors';
import { calibrationTableTemperatureK } from './calibration-table';
import { rtdResistance } from './rtd';

describe('calibrationTableTemperatureK', () => {
  it('reads a Pt100 table at 20 K spacing to within 0.01 K between its points', () => {
    // IEC 60751:2008 Pt100 (via rtdResistance) as the sensor's own table; its curvature is small,
    // so a cubic Hermite interpolant should be far better than the table's 0.01 ohm (0.026 K).
    const table = [];
    for (let t = 80; t <= 500; t += 20) table.push({ reading: rtdResistance(t), temperatureK: t });
    for (let t = 81; t < 500; t += 7.3) {
      expect(Math.abs(calibrationTableTemperatureK(table, rtdResistance(t)) - t)).toBeLessThan(
        0.01,
      );
    }
  });

  it('passes through its points and stays monotone on a falling diode-like table', () => {
    // Invented, diode-shaped (voltage falls as it warms); monotone by construction.
    const table = [
      { reading: 1.6, temperatureK: 4 },
      { reading: 1.4, temperatureK: 15 },
      { reading: 1.1, temperatureK: 30 },
      { reading: 1.05, temperatureK: 80 },
      { reading: 0.5, temperatureK: 300 },
    ];
    for (const p of table)
      expect(calibrationTableTemperatureK(table, p.reading)).toBeCloseTo(p.temperatureK, 9);
    let previous = Infinity;
    for (let v = 0.5; v <= 1.6; v += 0.01) {
      const t = calibrationTableTemperatureK(table, v);
      expect(t).toBeLessThanOrEqual(previous);
      previous = t;
    }
  });

  it('extrapolates up to 2 % of the span and refuses beyond', () => {
    const table = [
      { reading: 100, temperatureK: 100 },
      { reading: 200, temperatureK: 200 },
    ];
    expect(calibrationTableTemperatureK(table, 201.9)).toBeCloseTo(201.9, 9);
    expect(() => calibrationTableTemperatureK(table, 202.1)).toThrow(PhysicsInputError);
    expect(() => calibrationTableTemperatureK(table, 97.9)).toThrow(/within the calibration table/);
  });

  it('refuses a table that is not monotone or too short', () => {
    expect(() =>
      calibrationTableTemperatureK(
        [
          { reading: 1, temperatureK: 10 },
          { reading: 2, temperatureK: 20 },
          { reading: 3, temperatureK: 15 },
        ],
        1.5,
      ),
    ).toThrow(/rises or falls strictly/);
    expect(() => calibrationTableTemperatureK([{ reading: 1, temperatureK: 10 }], 1)).toThrow();
  });
});
