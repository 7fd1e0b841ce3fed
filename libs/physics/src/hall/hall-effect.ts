/**
 * Hall effect: the Hall voltage from field and current reversals, the Hall coefficient, carrier
 * density and Hall mobility, the Hall scattering factor and the two-carrier Hall coefficient.
 */
import { ELEMENTARY_CHARGE_C } from '../constants';
import { PhysicsInputError } from '../errors';
import {
  requireFiniteNumber,
  requireNonNegative,
  requireObject,
  requirePositive,
} from '../validate';

/**
 * Hall scattering factors r_H = <tau^2> / <tau>^2 for non-degenerate carriers in a parabolic
 * band: 3 pi / 8 (about 1.178) when acoustic phonons dominate (tau ~ E^-1/2), 315 pi / 512
 * (about 1.933) for ionized-impurity scattering (tau ~ E^3/2), and 1 for a degenerate gas or a
 * strong field. Source: Blakemore, Semiconductor Statistics (1962); Look, Electrical
 * Characterization of GaAs Materials and Devices (1989), ch. 1.
 */
export const HALL_SCATTERING_FACTORS = {
  acousticPhonon: (3 * Math.PI) / 8,
  ionizedImpurity: (315 * Math.PI) / 512,
  degenerate: 1,
} as const satisfies Record<string, number>;

/** The four Hall-probe voltages of one reading, V: xy = field sign x, current sign y. */
export interface HallReversals {
  /** +B, +I */
  pp: number;
  /** +B, -I */
  pn: number;
  /** -B, +I */
  np: number;
  /** -B, -I */
  nn: number;
}

/**
 * Hall voltage with the offset (contact misalignment) and thermoelectric voltages removed.
 *
 * Formula: V_H = ((V(+B,+I) - V(-B,+I)) - (V(+B,-I) - V(-B,-I))) / 4. Reversing the field
 * cancels the misalignment voltage (it does not change sign with B); reversing the current
 * cancels the thermoelectric offsets (they do not change sign with I). What remains is the part
 * odd in both B and I, the Hall voltage at +B, +I.
 * Source: van der Pauw, Philips Res. Rep. 13, 1 (1958); ASTM F76.
 *
 * @param v the four voltages, V (finite)
 * @returns V_H, V (signed: the sign at +B, +I)
 * @example hallVoltageFromReversals({ pp: 0.0012, pn: -0.0008, np: 0.0032, nn: -0.0028 }) // -0.001
 */
export function hallVoltageFromReversals(v: HallReversals): number {
  const fn = 'hallVoltageFromReversals';
  const o = requireObject(fn, 'v', v);
  const pp = requireFiniteNumber(fn, 'v.pp', o['pp']);
  const pn = requireFiniteNumber(fn, 'v.pn', o['pn']);
  const np = requireFiniteNumber(fn, 'v.np', o['np']);
  const nn = requireFiniteNumber(fn, 'v.nn', o['nn']);
  return (pp - np - (pn - nn)) / 4;
}

/** Input of `hallCoefficient`. */
export interface HallCoefficientInput {
  /** Hall voltage at +B, +I (offsets removed), V; signed. */
  hallVoltageV: number;
  /** Sample current, A (> 0; the sign convention is that of `hallVoltageV`). */
  currentA: number;
  /** Magnetic flux density through the sample, T (> 0). */
  magneticFieldT: number;
  /** Sample thickness, cm (> 0). */
  thicknessCm: number;
  /** Hall scattering factor r_H (> 0); default 1 (`HALL_SCATTERING_FACTORS.degenerate`). */
  hallFactor?: number;
}

/** Result of `hallCoefficient`. */
export interface HallCoefficientResult {
  /** R_H = V_H t / (I B), cm^3/C; negative for electrons. */
  hallCoefficientCm3PerC: number;
  /** R_H / t, cm^2/C. */
  sheetHallCoefficientCm2PerC: number;
  /** 'n' when R_H < 0 (electrons), 'p' otherwise. */
  carrierType: 'n' | 'p';
  /** r_H / (q |R_H|), cm^-3. */
  densityCm3: number;
  /** densityCm3 t, cm^-2. */
  sheetDensityCm2: number;
}

/**
 * Hall coefficient, carrier type and carrier density of a single-carrier sample.
 *
 * Formula: R_H = V_H t / (I B), with the field in V s / cm^2 (1 T = 1e-4 V s / cm^2) so that R_H
 * comes out in cm^3/C; n = r_H / (q |R_H|), n_s = n t. R_H < 0 means electrons (n-type).
 * Assumptions: one carrier type dominates (see `twoCarrierHallCoefficient` otherwise), a
 * uniform sample of known thickness, weak field (mu B << 1), V_H already free of offsets
 * (`hallVoltageFromReversals`).
 * Source: van der Pauw, Philips Res. Rep. 13, 1 (1958); ASTM F76; Look (1989), ch. 1.
 *
 * @param input Hall voltage (V), current (A), field (T), thickness (cm), optional r_H
 * @example hallCoefficient({ hallVoltageV: -1e-3, currentA: 1e-3, magneticFieldT: 0.5,
 *   thicknessCm: 0.05 }) // hallCoefficientCm3PerC -1000, densityCm3 6.24e15, carrierType 'n'
 */
export function hallCoefficient(input: HallCoefficientInput): HallCoefficientResult {
  const fn = 'hallCoefficient';
  const o = requireObject(fn, 'input', input);
  const vh = requireFiniteNumber(fn, 'input.hallVoltageV', o['hallVoltageV']);
  const current = requirePositive(fn, 'input.currentA', o['currentA']);
  const field = requirePositive(fn, 'input.magneticFieldT', o['magneticFieldT']);
  const t = requirePositive(fn, 'input.thicknessCm', o['thicknessCm']);
  const rH =
    o['hallFactor'] === undefined
      ? HALL_SCATTERING_FACTORS.degenerate
      : requirePositive(fn, 'input.hallFactor', o['hallFactor']);
  if (vh === 0) {
    throw new PhysicsInputError(
      fn,
      'input.hallVoltageV',
      'requires input.hallVoltageV other than 0 (a zero Hall voltage gives no carrier density)',
    );
  }
  const fieldVsPerCm2 = field * 1e-4;
  const coefficient = (vh * t) / (current * fieldVsPerCm2);
  const density = rH / (ELEMENTARY_CHARGE_C * Math.abs(coefficient));
  return {
    hallCoefficientCm3PerC: coefficient,
    sheetHallCoefficientCm2PerC: coefficient / t,
    carrierType: coefficient < 0 ? 'n' : 'p',
    densityCm3: density,
    sheetDensityCm2: density * t,
  };
}

/**
 * Hall mobility mu_H = |R_H| / rho.
 *
 * It equals the drift mobility times r_H for one carrier type. Source: ASTM F76; Look (1989).
 *
 * @param hallCoefficientCm3PerC R_H, cm^3/C (signed, not 0)
 * @param resistivityOhmCm rho, ohm cm (> 0)
 * @returns cm^2/(V s)
 * @example hallMobility(-1000, 1) // 1000
 */
export function hallMobility(hallCoefficientCm3PerC: number, resistivityOhmCm: number): number {
  const fn = 'hallMobility';
  const rh = requireFiniteNumber(fn, 'hallCoefficientCm3PerC', hallCoefficientCm3PerC);
  const rho = requirePositive(fn, 'resistivityOhmCm', resistivityOhmCm);
  if (rh === 0) {
    throw new PhysicsInputError(
      fn,
      'hallCoefficientCm3PerC',
      'requires hallCoefficientCm3PerC other than 0',
    );
  }
  return Math.abs(rh) / rho;
}

/** Input of `twoCarrierHallCoefficient`: densities cm^-3, mobilities cm^2/(V s). */
export interface TwoCarrierInput {
  electronDensityCm3: number;
  holeDensityCm3: number;
  electronMobility: number;
  holeMobility: number;
}

/**
 * Low-field Hall coefficient of a sample with electrons and holes (r_H = 1 for both).
 *
 * Formula: R_H = (p mu_p^2 - n mu_n^2) / (q (p mu_p + n mu_n)^2), cm^3/C. It changes sign where
 * p mu_p^2 = n mu_n^2, which is why a p-type sample can read n-type near its intrinsic range.
 * Source: Look (1989), ch. 1; Blakemore (1962).
 *
 * @param input densities (>= 0, not both 0) and mobilities (> 0)
 * @example twoCarrierHallCoefficient({ electronDensityCm3: 1e15, holeDensityCm3: 1e15,
 *   electronMobility: 3, holeMobility: 1 }) // -0.5 / (q 1e15) = -3121 cm^3/C
 */
export function twoCarrierHallCoefficient(input: TwoCarrierInput): number {
  const fn = 'twoCarrierHallCoefficient';
  const o = requireObject(fn, 'input', input);
  const n = requireNonNegative(fn, 'input.electronDensityCm3', o['electronDensityCm3']);
  const p = requireNonNegative(fn, 'input.holeDensityCm3', o['holeDensityCm3']);
  const mun = requirePositive(fn, 'input.electronMobility', o['electronMobility']);
  const mup = requirePositive(fn, 'input.holeMobility', o['holeMobility']);
  if (n === 0 && p === 0) {
    throw new PhysicsInputError(
      fn,
      'input.electronDensityCm3',
      'requires input.electronDensityCm3 or input.holeDensityCm3 above 0',
    );
  }
  const sigma = p * mup + n * mun;
  return (p * mup * mup - n * mun * mun) / (ELEMENTARY_CHARGE_C * sigma * sigma);
}
