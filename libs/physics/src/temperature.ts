/**
 * Celsius–kelvin conversions.
 */
import { ZERO_CELSIUS_K } from './constants';
import { PhysicsInputError } from './errors';
import { requireFiniteNumber } from './validate';

/**
 * Converts degrees Celsius to kelvin: T = t + 273.15 (exact, SI definition).
 *
 * @param temperatureCelsius temperature, °C (at or above -273.15)
 * @returns temperature, K
 * @example celsiusToKelvin(23) // 296.15
 */
export function celsiusToKelvin(temperatureCelsius: number): number {
  const t = requireFiniteNumber('celsiusToKelvin', 'temperatureCelsius', temperatureCelsius);
  if (t < -ZERO_CELSIUS_K) {
    throw new PhysicsInputError(
      'celsiusToKelvin',
      'temperatureCelsius',
      `requires temperatureCelsius of at least -273.15, got ${t}`,
    );
  }
  return t + ZERO_CELSIUS_K;
}

/**
 * Converts kelvin to degrees Celsius: t = T - 273.15 (exact, SI definition).
 *
 * @param temperatureK temperature, K (at or above 0)
 * @returns temperature, °C
 * @example kelvinToCelsius(373.15) // 100
 */
export function kelvinToCelsius(temperatureK: number): number {
  const t = requireFiniteNumber('kelvinToCelsius', 'temperatureK', temperatureK);
  if (t < 0)
    throw new PhysicsInputError(
      'kelvinToCelsius',
      'temperatureK',
      `requires temperatureK of at least 0, got ${t}`,
    );
  return t - ZERO_CELSIUS_K;
}
