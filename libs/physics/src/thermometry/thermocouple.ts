/**
 * Thermocouples: the ITS-90 reference functions of the eight letter-designated types (NIST
 * Monograph 175, 1993; IEC 60584-1:2013) forward, and their inverse with cold-junction
 * compensation.
 */
import { BOUND_ALLOWANCE_K, ZERO_CELSIUS_K } from '../constants';
import { PhysicsInputError } from '../errors';
import { brentRoot } from '../numeric/brent';
import { requireFiniteNumber, requireInRange, requireOneOf } from '../validate';
import {
  THERMOCOUPLE_REFERENCE,
  THERMOCOUPLE_TYPES,
  type ReferenceRange,
  type ThermocoupleType,
} from './thermocouple-coefficients';

/**
 * The temperatures (°C) the inverse covers for each type: those of the published inverse
 * functions of NIST Monograph 175. Below them the EMF changes too little per kelvin to read a
 * temperature (type B is not even single-valued below about 42 °C).
 */
export const THERMOCOUPLE_INVERSE_RANGE_CELSIUS: Readonly<
  Record<ThermocoupleType, readonly [number, number]>
> = {
  B: [250, 1820],
  E: [-200, 1000],
  J: [-210, 1200],
  K: [-200, 1372],
  N: [-200, 1300],
  R: [-50, 1768.1],
  S: [-50, 1768.1],
  T: [-200, 400],
};

/** Solving to this (°C) is far below the 0.02–0.06 °C error of the published inverse fits. */
const INVERSE_TOLERANCE_CELSIUS = 1e-9;

function rangeOf(ranges: readonly ReferenceRange[], celsius: number): ReferenceRange {
  return ranges.find((r) => celsius <= r.maxCelsius) ?? ranges[ranges.length - 1]!;
}

/** The reference function at `celsius` (trusted to lie in the type's range). */
function referenceEmfMv(type: ThermocoupleType, celsius: number): number {
  const range = rangeOf(THERMOCOUPLE_REFERENCE[type], celsius);
  let emf = 0;
  for (const c of range.hornerCoefficients) emf = emf * celsius + c;
  if (range.exponential) {
    const [a0, a1, a2] = range.exponential;
    emf += a0 * Math.exp(a1 * (celsius - a2) ** 2);
  }
  return emf;
}

function fullRangeCelsius(type: ThermocoupleType): [number, number] {
  const ranges = THERMOCOUPLE_REFERENCE[type];
  return [ranges[0]!.minCelsius, ranges[ranges.length - 1]!.maxCelsius];
}

/**
 * Thermoelectric EMF of a thermocouple with its reference junction at 0 °C.
 *
 * Formula: the ITS-90 reference function of the type, E = sum c_i t^i over the range holding
 * t (°C); type K above 0 °C adds a0 exp(a1 (t - a2)^2). Coefficients in
 * `THERMOCOUPLE_REFERENCE`.
 * Range: each type's full range (B 0 to 1820 °C, E -270 to 1000 °C, J -210 to 1200 °C, K -270
 * to 1372 °C, N -270 to 1300 °C, R and S -50 to 1768.1 °C, T -270 to 400 °C).
 * Source: NIST Monograph 175 (Burns et al., 1993); IEC 60584-1:2013.
 *
 * @param type thermocouple type, one of B, E, J, K, N, R, S, T
 * @param temperatureK temperature of the measuring junction, K
 * @returns EMF, mV (reference junction at 0 °C)
 * @example thermocoupleEmfMv('K', 373.15) // 4.096 (mV)
 */
export function thermocoupleEmfMv(type: ThermocoupleType, temperatureK: number): number {
  const fn = 'thermocoupleEmfMv';
  const t = requireOneOf(fn, 'type', type, THERMOCOUPLE_TYPES);
  const [lo, hi] = fullRangeCelsius(t);
  const k = requireInRange(
    fn,
    'temperatureK',
    temperatureK,
    lo + ZERO_CELSIUS_K,
    hi + ZERO_CELSIUS_K,
    {
      what: `a type ${t} temperature`,
      unit: 'K',
      allowance: BOUND_ALLOWANCE_K,
    },
  );
  return referenceEmfMv(t, k - ZERO_CELSIUS_K);
}

/**
 * Temperature of a thermocouple's measuring junction from its EMF, with cold-junction
 * compensation: the EMF the same thermocouple would give against 0 °C is
 * E = emf + E(T_ref), and the temperature is the root of the reference function at E.
 *
 * Method: the reference function is inverted numerically (Brent's method to 1e-9 °C), so the
 * result agrees with `thermocoupleEmfMv` to far better than the published inverse polynomials
 * (0.02 to 0.06 °C); the result is the reference function's own temperature.
 * Range: the published inverse ranges, `THERMOCOUPLE_INVERSE_RANGE_CELSIUS`; the reference
 * junction must lie in the type's full range.
 * Source: NIST Monograph 175 (Burns et al., 1993); IEC 60584-1:2013.
 *
 * @param type thermocouple type, one of B, E, J, K, N, R, S, T
 * @param emfMv measured EMF, mV
 * @param referenceJunctionK temperature of the reference (cold) junction, K (default 273.15)
 * @returns temperature of the measuring junction, K
 * @example thermocoupleTemperatureK('K', 1.0, 296.15) // 320.63 (K; 47.48 °C)
 */
export function thermocoupleTemperatureK(
  type: ThermocoupleType,
  emfMv: number,
  referenceJunctionK = ZERO_CELSIUS_K,
): number {
  const fn = 'thermocoupleTemperatureK';
  const t = requireOneOf(fn, 'type', type, THERMOCOUPLE_TYPES);
  const emf = requireFiniteNumber(fn, 'emfMv', emfMv);
  const [fullLo, fullHi] = fullRangeCelsius(t);
  const refK = requireInRange(
    fn,
    'referenceJunctionK',
    referenceJunctionK,
    fullLo + ZERO_CELSIUS_K,
    fullHi + ZERO_CELSIUS_K,
    { what: `a type ${t} reference junction temperature`, unit: 'K', allowance: BOUND_ALLOWANCE_K },
  );
  const total = emf + referenceEmfMv(t, refK - ZERO_CELSIUS_K);
  const [lo, hi] = THERMOCOUPLE_INVERSE_RANGE_CELSIUS[t];
  const eLo = referenceEmfMv(t, lo);
  const eHi = referenceEmfMv(t, hi);
  // Half a microvolt: the last digit of the published tables, so a tabulated end value reads.
  const allowanceMv = 0.0005;
  if (total < eLo - allowanceMv || total > eHi + allowanceMv) {
    throw new PhysicsInputError(
      fn,
      'emfMv',
      `requires a type ${t} EMF that, with the reference junction at ${refK} K, lies between ` +
        `${(eLo - total + emf).toFixed(3)} and ${(eHi - total + emf).toFixed(3)} mV ` +
        `(${lo} to ${hi} °C), got ${emf}`,
    );
  }
  if (total <= eLo) return lo + ZERO_CELSIUS_K;
  if (total >= eHi) return hi + ZERO_CELSIUS_K;
  const root = brentRoot((c) => referenceEmfMv(t, c) - total, lo, hi, INVERSE_TOLERANCE_CELSIUS);
  if (!root.converged) {
    throw new PhysicsInputError(fn, 'emfMv', `could not invert the type ${t} EMF ${emf} mV`);
  }
  return root.root + ZERO_CELSIUS_K;
}
