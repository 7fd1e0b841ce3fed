import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { celsiusToKelvin, kelvinToCelsius } from './temperature';

describe('celsiusToKelvin and kelvinToCelsius', () => {
  it('use the SI offset 273.15', () => {
    // SI brochure (BIPM 2019): T/K = t/°C + 273.15. Exact.
    expect(celsiusToKelvin(0)).toBe(273.15);
    expect(celsiusToKelvin(23)).toBeCloseTo(296.15, 12);
    expect(kelvinToCelsius(373.15)).toBeCloseTo(100, 12);
  });
  it('are inverses', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -273.15, max: 5000, noNaN: true }),
        (t) => Math.abs(kelvinToCelsius(celsiusToKelvin(t)) - t) < 1e-9,
      ),
    );
  });
});

describe('temperature conversion invalid inputs', () => {
  it('rejects values below absolute zero and non-numbers', () => {
    expect(() => celsiusToKelvin(-300)).toThrow(/`celsiusToKelvin`.*temperatureCelsius/);
    expect(() => kelvinToCelsius(-1)).toThrow(/`kelvinToCelsius`.*temperatureK/);
    expect(() => kelvinToCelsius('1' as unknown as number)).toThrow(TypeError);
  });
});
