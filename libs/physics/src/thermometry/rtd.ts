/**
 * Industrial platinum resistance thermometers (IEC 60751 Callendar–Van Dusen form).
 */
import { BOUND_ALLOWANCE_K, ZERO_CELSIUS_K } from '../constants';
import { PHYSICS_DEFAULTS } from '../defaults';
import { PhysicsInputError } from '../errors';
import { requireFiniteNumber, requireInRange, requirePositive } from '../validate';

/** IEC 60751 coefficients and range. */
export const IEC_60751 = {
  /** 1/°C */
  a: 3.9083e-3,
  /** 1/°C^2 */
  b: -5.775e-7,
  /** 1/°C^4, used only below 0 °C */
  c: -4.183e-12,
  minCelsius: -200,
  maxCelsius: 850,
} as const;

/** Half a unit in the last place of the IEC 60751 Pt100 table (0.005 ohm), as a ratio R/R0. */
const TABLE_ROUNDING_RATIO = 0.005 / 100;

function ratioAt(t: number): number {
  const { a, b, c } = IEC_60751;
  const cubic = t < 0 ? c * (t - 100) * t * t * t : 0;
  return 1 + a * t + b * t * t + cubic;
}

function ratioDerivative(t: number): number {
  const { a, b, c } = IEC_60751;
  const cubic = t < 0 ? c * (4 * t * t * t - 300 * t * t) : 0;
  return a + 2 * b * t + cubic;
}

/**
 * Resistance of an IEC 60751 platinum thermometer.
 *
 * Formula: R(t) = R0 [1 + A t + B t^2 + C (t - 100) t^3], t in °C, C term only below 0 °C;
 * A = 3.9083e-3, B = -5.775e-7, C = -4.183e-12 (`IEC_60751`).
 * Range: -200 °C to 850 °C inclusive (73.15 K to 1123.15 K, with 1e-9 K rounding allowance).
 * Source: IEC 60751:2008, Industrial platinum resistance thermometers and platinum temperature
 * sensors.
 *
 * @param temperatureK temperature, K
 * @param r0Ohm resistance at 0 °C, ohm (default `PHYSICS_DEFAULTS.rtdR0Ohm` = 100, Pt100)
 * @returns resistance, ohm
 * @example rtdResistance(373.15) // 138.5055 (ohm)
 */
export function rtdResistance(
  temperatureK: number,
  r0Ohm: number = PHYSICS_DEFAULTS.rtdR0Ohm,
): number {
  const tk = requireInRange(
    'rtdResistance',
    'temperatureK',
    temperatureK,
    IEC_60751.minCelsius + ZERO_CELSIUS_K,
    IEC_60751.maxCelsius + ZERO_CELSIUS_K,
    { what: 'a temperature', unit: 'K', allowance: BOUND_ALLOWANCE_K },
  );
  const r0 = requirePositive('rtdResistance', 'r0Ohm', r0Ohm);
  return r0 * ratioAt(tk - ZERO_CELSIUS_K);
}

/**
 * Temperature of an IEC 60751 platinum thermometer from its resistance (inverse of
 * `rtdResistance`).
 *
 * Method: at or above R0 the quadratic has the closed-form root
 * t = (-A + sqrt(A^2 - 4 B (1 - R/R0))) / (2 B); below R0 Newton's method on the full quartic,
 * started from that root, converges to 1e-12 °C in a few steps (R(t) is monotonic on the range).
 * Range: R(-200 °C) to R(850 °C) (18.52008 to 390.4811 ohm for a Pt100). Readings up to half a
 * unit of the standard's two-decimal table (0.005 ohm per 100 ohm of R0) outside the range are
 * accepted and reported as the bound, so the tabulated 18.52 ohm reads as -200 °C.
 * Source: IEC 60751:2008.
 *
 * @param resistanceOhm measured resistance, ohm
 * @param r0Ohm resistance at 0 °C, ohm (default `PHYSICS_DEFAULTS.rtdR0Ohm` = 100)
 * @returns temperature, K
 * @example rtdTemperatureK(138.5055) // 373.15 (K)
 */
export function rtdTemperatureK(
  resistanceOhm: number,
  r0Ohm: number = PHYSICS_DEFAULTS.rtdR0Ohm,
): number {
  const r = requireFiniteNumber('rtdTemperatureK', 'resistanceOhm', resistanceOhm);
  const r0 = requirePositive('rtdTemperatureK', 'r0Ohm', r0Ohm);
  const { a, b, minCelsius, maxCelsius } = IEC_60751;
  const lo = ratioAt(minCelsius);
  const hi = ratioAt(maxCelsius);
  const ratio = r / r0;
  if (ratio < lo - TABLE_ROUNDING_RATIO || ratio > hi + TABLE_ROUNDING_RATIO) {
    throw new PhysicsInputError(
      'rtdTemperatureK',
      'resistanceOhm',
      `requires a resistance (resistanceOhm) between ${(lo * r0).toPrecision(7)} ` +
        `and ${(hi * r0).toPrecision(7)} ohm for R0 = ${r0} ohm, got ${r}`,
    );
  }
  const x = Math.min(hi, Math.max(lo, ratio));
  let t = (-a + Math.sqrt(a * a - 4 * b * (1 - x))) / (2 * b);
  if (x < 1) {
    for (let i = 0; i < 50; i++) {
      const step = (ratioAt(t) - x) / ratioDerivative(t);
      t -= step;
      if (Math.abs(step) < 1e-12) break;
    }
  }
  return Math.min(maxCelsius, Math.max(minCelsius, t)) + ZERO_CELSIUS_K;
}
